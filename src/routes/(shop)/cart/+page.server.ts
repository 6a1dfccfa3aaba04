import { fail } from '@sveltejs/kit';
import {
	CartError,
	cartIdFrom,
	cartSummary,
	ensureCart,
	removeLine,
	setDestination,
	setQuantity
} from '$lib/server/cart';
import { returnUnpaid } from '$lib/server/orders/payment';
import {
	destinationSchema,
	fieldErrors,
	removeLineSchema,
	setQuantitySchema
} from '$lib/schemas/cart';
import { COUNTRIES } from '$lib/shipping';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

export const load: PageServerLoad = async ({ cookies, url }) => {
	const cartId = cartIdFrom(cookies);
	let returned: { cancelled: boolean; declined: string | null; paid: boolean } | null = null;
	if (url.searchParams.get('cancelled') === '1') {
		const r = await returnUnpaid(url.searchParams.get('order'), cartId);
		returned = { cancelled: true, declined: r.declined, paid: r.paid };
	}
	return { summary: await cartSummary(cartId), returned, countries: COUNTRIES };
};

/** The same changes as /api/cart, for browsers without JavaScript. */
async function act(
	event: RequestEvent,
	fn: (cartId: string, form: Record<string, FormDataEntryValue>) => Promise<void>
) {
	const form = Object.fromEntries(await event.request.formData());
	try {
		const cartId = await ensureCart(
			event.cookies,
			event.locals.user?.id ?? null,
			event.url.protocol === 'https:'
		);
		await fn(cartId, form);
		return { ok: true };
	} catch (err) {
		if (err instanceof CartError)
			return fail(err.status === 404 ? 404 : 400, { error: err.message, fields: err.fields });
		if (err instanceof FormError) return fail(400, { error: err.message, fields: err.fields });
		throw err;
	}
}

class FormError extends Error {
	constructor(public fields: Record<string, string[]>) {
		super(Object.values(fields)[0]?.[0] ?? 'Check the form.');
	}
}

export const actions: Actions = {
	quantity: (event) =>
		act(event, async (cartId, form) => {
			const r = setQuantitySchema.safeParse(form);
			if (!r.success) throw new FormError(fieldErrors(r.error));
			await setQuantity(cartId, r.data.lineId, r.data.quantity);
		}),
	remove: (event) =>
		act(event, async (cartId, form) => {
			const r = removeLineSchema.safeParse(form);
			if (!r.success) throw new FormError(fieldErrors(r.error));
			await removeLine(cartId, r.data.lineId);
		}),
	destination: (event) =>
		act(event, async (cartId, form) => {
			const r = destinationSchema.safeParse(form);
			if (!r.success || !(COUNTRIES as readonly string[]).includes(r.data.country)) {
				throw new FormError({ country: ['Choose a country from the list.'] });
			}
			await setDestination(cartId, r.data.country);
		})
};
