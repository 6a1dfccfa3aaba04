import { fail } from '@sveltejs/kit';
import { pieceForm, pieceFormInput } from '$lib/schemas/piece';
import { SlugTaken, unknownWoodIds } from '$lib/server/catalogue/pieces-admin';
import type { PieceForm } from '$lib/schemas/piece';

type FieldErrors = Record<string, string[]>;

/**
 * Parses the piece form and runs the save; on bad input or a taken address answers 400 with the
 * messages beside the fields and the values typed, so nothing is half-written.
 */
export async function savePieceForm(request: Request, save: (f: PieceForm) => Promise<unknown>) {
	const input = pieceFormInput(await request.formData());
	const parsed = pieceForm.safeParse(input);
	const values = input;
	if (!parsed.success) {
		const errors: FieldErrors = {};
		for (const issue of parsed.error.issues) {
			const key = String(issue.path[0] ?? 'form');
			(errors[key] ??= []).push(issue.message);
		}
		return { failure: fail(400, { errors, values }) };
	}
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
