import { fail, redirect } from '@sveltejs/kit';
import { cartIdFrom, cartSummary } from '$lib/server/cart';
import { OrderError, placeOrder } from '$lib/server/orders/place';
import { checkoutSchema } from '$lib/schemas/checkout';
import { fieldErrors } from '$lib/schemas/cart';
import { COUNTRIES } from '$lib/shipping';
import type { Actions, PageServerLoad } from './$types';
import { formText } from '$lib/form-text';

export const load: PageServerLoad = async ({ cookies, locals }) => {
	const summary = await cartSummary(cartIdFrom(cookies));
	if (summary.lines.length === 0) redirect(303, '/cart');
	return {
		summary,
		countries: COUNTRIES,
		buyer: { name: locals.user?.name ?? '', email: locals.user?.email ?? '' }
	};
};

export const actions: Actions = {
	default: async ({ request, cookies, locals, url }) => {
		const raw = Object.fromEntries(await request.formData());
		const values = Object.fromEntries(
			Object.entries(raw)
				.filter(([k]) => k !== 'seenTotal')
				.map(([k, v]) => [k, formText(v)])
		);
		const parsed = checkoutSchema.safeParse(raw);
		if (!parsed.success) return fail(400, { errors: fieldErrors(parsed.error), values });

		const cartId = cartIdFrom(cookies);
		if (!cartId) return fail(409, { errors: { form: ['Your basket is empty.'] }, values });

		let placed;
		try {
			placed = await placeOrder(cartId, parsed.data, locals.user?.id ?? null, url.origin);
		} catch (err) {
			if (err instanceof OrderError)
				return fail(err.status, { errors: { form: [err.message] }, values, code: err.code });
			throw err;
		}
		redirect(303, placed.paymentUrl);
	}
};
