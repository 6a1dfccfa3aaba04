import { fail } from '@sveltejs/kit';
import { parseForm } from '$lib/forms/parse-form';
import { pieceForm, pieceFormInput } from '$lib/catalogue/piece-schema';
import { SlugTaken, unknownWoodIds } from '$lib/server/catalogue/pieces-admin';
import type { PieceForm } from '$lib/catalogue/piece-schema';

/**
 * Parses the piece form and runs the save; on bad input or a taken address answers 400 with the
 * messages beside the fields and the values typed, so nothing is half-written.
 */
export async function savePieceForm(request: Request, save: (f: PieceForm) => Promise<unknown>) {
	const form = await request.formData();
	// The form echoes the piece's own shape (woods as a list, the tick box as a boolean).
	const values = pieceFormInput(form);
	const parsed = await parseForm(form, pieceForm, { input: () => values });
	if (!parsed.ok) return { failure: fail(400, { errors: parsed.errors, values }) };
	const unknown = await unknownWoodIds(parsed.data.woodIds);
	if (unknown.length) {
		return { failure: fail(400, { errors: { woodIds: ['Choose woods from the list.'] }, values }) };
	}
	try {
		return { result: await save(parsed.data) };
	} catch (err) {
		if (err instanceof SlugTaken)
			return { failure: fail(400, { errors: { slug: [err.message] }, values }) };
		throw err;
	}
}
