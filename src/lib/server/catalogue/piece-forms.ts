/**
 * The workshop's piece forms answered the same way on every page: bad input, a taken address or
 * a photo that is gone comes back as a 4xx with its message, so nothing is half-written.
 */
import { error } from '@sveltejs/kit';
import type { z } from 'zod';
import { formFail, parseForm } from '$lib/forms/parse-form';
import { pieceForm, pieceFormInput, type PieceForm } from '$lib/catalogue/piece-schema';
import { isFailure, orFail, runForm } from '../errors/form-answer';
import { unknownWoodIds } from './pieces-admin';

/** A piece's id from its address; anything but a positive whole number is a page not found. */
export function pieceIdParam(raw: string) {
	const id = Number(raw);
	if (!Number.isInteger(id) || id <= 0) error(404, 'There is no such piece.');
	return id;
}

/**
 * Parses the piece form and runs the save; on bad input or a taken address answers 400 with the
 * messages beside the fields and the values typed.
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

/** Reads a photo form and runs the change; bad input or a photo that is gone answers 400/404. */
export async function photoForm<S extends z.ZodType>(
	request: Request,
	schema: S,
	run: (p: z.infer<S>) => Promise<void>
) {
	const saved = (p: z.infer<S>) => run(p).then(() => ({ photoSaved: true }));
	return runForm(request, schema, saved, { form: 'photo' });
}
