import { formFail, parseForm } from '$lib/forms/parse-form';
import { isFailure, orFail } from '$lib/server/errors/form-answer';
import { pieceForm, pieceFormInput } from '$lib/catalogue/piece-schema';
import { unknownWoodIds } from '$lib/server/catalogue/pieces-admin';
import type { PieceForm } from '$lib/catalogue/piece-schema';

/**
 * Parses the piece form and runs the save; on bad input or a taken address answers 400 with the
 * messages beside the fields and the values typed, so nothing is half-written.
 */
export async function savePieceForm(request: Request, save: (f: PieceForm) => Promise<unknown>) {
	// The form echoes the piece's own shape (woods as a list, the tick box as a boolean).
	const parsed = await parseForm(request, pieceForm, { input: (_, form) => pieceFormInput(form) });
	if (!parsed.ok) {
		const values = parsed.input as ReturnType<typeof pieceFormInput>;
		const message = parsed.issues[0]?.message ?? 'Check the form.';
		return { failure: formFail(400, message, { errors: parsed.errors, values }) };
	}
	const values = pieceFormInput(parsed.form);
	if ((await unknownWoodIds(parsed.data.woodIds)).length) {
		const message = 'Choose woods from the list.';
		return { failure: formFail(400, message, { errors: { woodIds: [message] }, values }) };
	}
	const result = await orFail(() => save(parsed.data), { values });
	return isFailure(result) ? { failure: result } : { result };
}
