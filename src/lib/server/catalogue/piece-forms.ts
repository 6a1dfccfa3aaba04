/**
 * The workshop's piece forms answered the same way on every page: bad input, a taken address or
 * a photo that is gone comes back as a 4xx with its message, so nothing is half-written.
 */
import { error, fail } from '@sveltejs/kit';
import type { z } from 'zod';
import { firstError, parseForm } from '$lib/forms/parse-form';
import { pieceForm, pieceFormInput, type PieceForm } from '$lib/catalogue/piece-schema';
import { SlugTaken, unknownWoodIds } from './pieces-admin';
import { PhotoNotFound } from './photos';

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

/** Reads a photo form and runs the change; bad input or a photo that is gone answers 400/404. */
export async function photoForm<S extends z.ZodType>(
	request: Request,
	schema: S,
	run: (p: z.infer<S>) => Promise<void>
) {
	const parsed = await parseForm(request, schema);
	if (!parsed.ok) return fail(400, { photoError: firstError(parsed.errors) });
	try {
		await run(parsed.data);
	} catch (err) {
		if (err instanceof PhotoNotFound) return fail(404, { photoError: err.message });
		throw err;
	}
	return { photoSaved: true };
}
