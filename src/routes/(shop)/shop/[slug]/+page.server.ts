import { error, fail } from '@sveltejs/kit';
import { piecePage, redrawnPreview } from '$lib/server/catalogue/piece-page';
import { addLine, CartError, cartCount, ensureCart } from '$lib/server/cart';
import { addLineSchema } from '$lib/cart/cart-schema';
import { fieldErrors, formTexts } from '$lib/forms/parse-form';
import { initialsMissing } from '$lib/pattern/initials-rule';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params }) => {
	const page = await piecePage(params.slug);
	if (!page) error(404, 'We do not have a piece at this address.');
	return page;
};

export const actions: Actions = {
	/** Adds the piece, personalised or ready-made; the server checks and prices it again. */
	add: async ({ request, params, cookies, locals, url }) => {
		const form = formTexts(await request.formData());
		const personalised = form.mode === 'personalised';
		const values = {
			mode: personalised ? 'personalised' : 'ready',
			initials: form.initials ?? '',
			wood: form.wood ?? '',
			style: form.style ?? '',
			quantity: form.quantity ?? '1'
		};
		// Not parseForm: a personalised line also needs initials, and the answer carries a preview.
		const parsed = addLineSchema.safeParse({ ...form, slug: params.slug });
		const errors = parsed.success ? {} : fieldErrors(parsed.error);
		const missing = initialsMissing(values.mode, values.initials);
		if (missing) errors.initials = [missing];
		if (!parsed.success || Object.keys(errors).length) {
			return fail(400, { errors, values, preview: await redrawnPreview(params.slug, values) });
		}

		const input = { ...parsed.data, initials: personalised ? parsed.data.initials : undefined };
		try {
			const cartId = await ensureCart(cookies, locals.user?.id ?? null, url.protocol === 'https:');
			await addLine(cartId, input);
			return { added: true, count: await cartCount(cartId), values };
		} catch (err) {
			if (err instanceof CartError) {
				return fail(err.status === 404 ? 404 : 400, {
					errors: err.fields ?? { form: [err.message] },
					values,
					preview: err.fields?.initials ? await redrawnPreview(params.slug, values) : undefined
				});
			}
			throw err;
		}
	}
};
