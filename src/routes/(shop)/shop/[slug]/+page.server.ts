import { error } from '@sveltejs/kit';
import { piecePage, redrawnPreview } from '$lib/server/catalogue/piece-page';
import { addLine, cartCount, ensureCart } from '$lib/server/cart';
import { DomainError } from '$lib/server/errors/domain-error';
import { failFrom } from '$lib/server/errors/form-answer';
import { addLineSchema } from '$lib/cart/cart-schema';
import { firstError, formFail, parseForm } from '$lib/forms/parse-form';
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
		// A personalised line also needs initials, and the answer carries a preview.
		const parsed = await parseForm(request, addLineSchema, {
			input: (texts) => ({ ...texts, slug: params.slug })
		});
		const form = parsed.values;
		const personalised = form.mode === 'personalised';
		const values = {
			mode: personalised ? 'personalised' : 'ready',
			initials: form.initials ?? '',
			wood: form.wood ?? '',
			style: form.style ?? '',
			quantity: form.quantity ?? '1'
		};
		// Without JavaScript the page comes back drawn for what was typed, not the blank default,
		// with the ways out when the letters are too small.
		const errors = parsed.ok ? {} : { ...parsed.errors };
		const missing = initialsMissing(values.mode, values.initials);
		if (missing) errors.initials = [missing];
		if (!parsed.ok || Object.keys(errors).length) {
			const message = firstError(errors) ?? 'Check the form.';
			const preview = await redrawnPreview(params.slug, values);
			return formFail(400, message, { errors, values, preview });
		}

		const input = { ...parsed.data, initials: personalised ? parsed.data.initials : undefined };
		try {
			const cartId = await ensureCart(cookies, locals.user?.id ?? null, url.protocol === 'https:');
			await addLine(cartId, input);
			return { added: true, count: await cartCount(cartId), values };
		} catch (err) {
			if (err instanceof DomainError) {
				const preview = err.fields?.initials
					? await redrawnPreview(params.slug, values)
					: undefined;
				return failFrom(err, { values, preview });
			}
			throw err;
		}
	}
};
