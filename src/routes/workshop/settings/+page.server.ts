import { fail } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/auth/guard';
import { getSalesTaxBp, setSalesTaxBp } from '$lib/server/settings';
import type { Actions, PageServerLoad } from './$types';
import { formText } from '$lib/form-text';

/** The rate as typed, in percent with up to two decimals (7.25 → 725 basis points). */
const taxSchema = z.object({
	rate: z
		.string()
		.trim()
		.regex(/^\d{1,2}(\.\d{1,2})?$/, 'Type a percentage like 7.25, or 0 for none.')
		.transform((s) => Math.round(Number(s) * 100))
		.pipe(
			z.number().int().min(0).max(2500, 'That is higher than any sales tax we know of; check it.')
		)
});

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'owner');
	return { rateBp: await getSalesTaxBp() };
};

export const actions: Actions = {
	tax: async (event) => {
		requireRole(event, 'owner');
		const form = Object.fromEntries(await event.request.formData());
		const parsed = taxSchema.safeParse(form);
		if (!parsed.success) {
			return fail(400, {
				errors: { rate: [parsed.error.issues[0].message] },
				values: { rate: formText(form.rate) }
			});
		}
		await setSalesTaxBp(parsed.data.rate);
		return { saved: true };
	}
};
