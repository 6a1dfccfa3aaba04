import { fail } from '@sveltejs/kit';
import type { z } from 'zod';
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
import { destinationSchema, removeLineSchema, setQuantitySchema } from '$lib/cart/cart-schema';
import { parseForm } from '$lib/forms/parse-form';
import { COUNTRIES } from '$lib/locale/countries';
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

/**
 * The same changes as /api/cart, for browsers without JavaScript: parsed first (bad input never
 * creates a basket), then run; a refusal answers `fail(4xx, { errors, values })`.
 */
async function act<S extends z.ZodType>(
	event: RequestEvent,
	schema: S,
	run: (cartId: string, input: z.output<S>) => Promise<void>
) {
	const parsed = await parseForm(event.request, schema);
	if (!parsed.ok) return parsed.failure;
	try {
		const cartId = await ensureCart(
			event.cookies,
			event.locals.user?.id ?? null,
			event.url.protocol === 'https:'
		);
		await run(cartId, parsed.data);
		return { ok: true };
	} catch (err) {
		if (err instanceof CartError)
			return fail(err.status === 404 ? 404 : 400, {
				errors: { form: [err.message], ...err.fields },
				values: parsed.values
			});
		throw err;
	}
}

/** Only the countries we post to; the message the page shows beside the list. */
const knownDestination = destinationSchema.refine(
	(d) => (COUNTRIES as readonly string[]).includes(d.country),
	{ message: 'Choose a country from the list.', path: ['country'] }
);

export const actions: Actions = {
	quantity: (event) =>
		act(event, setQuantitySchema, (cartId, r) => setQuantity(cartId, r.lineId, r.quantity)),
	remove: (event) => act(event, removeLineSchema, (cartId, r) => removeLine(cartId, r.lineId)),
	destination: (event) =>
		act(event, knownDestination, (cartId, r) => setDestination(cartId, r.country))
};
