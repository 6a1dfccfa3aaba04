import type { z } from 'zod';
import {
	cartIdFrom,
	cartSummary,
	ensureCart,
	removeLine,
	setDestination,
	setQuantity
} from '$lib/server/cart';
import { returnUnpaid } from '$lib/server/orders/payment';
import { knownDestinationSchema, removeLineSchema, setQuantitySchema } from '$lib/cart/cart-schema';
import { orFail } from '$lib/server/errors/form-answer';
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
 * creates a basket), then run; a refusal answers the one form failure (`orFail`).
 */
async function act<S extends z.ZodType>(
	event: RequestEvent,
	schema: S,
	run: (cartId: string, input: z.output<S>) => Promise<void>
) {
	const parsed = await parseForm(event.request, schema);
	if (!parsed.ok) return parsed.failure;
	return orFail(
		async () => {
			const { cookies, locals, url } = event;
			const cartId = await ensureCart(cookies, locals.user?.id ?? null, url.protocol === 'https:');
			await run(cartId, parsed.data);
			return { ok: true };
		},
		{ values: parsed.values }
	);
}

/** Only the countries we post to; the message the page shows beside the list. */
const knownDestination = knownDestinationSchema('Choose a country from the list.');

export const actions: Actions = {
	quantity: (event) =>
		act(event, setQuantitySchema, (cartId, r) => setQuantity(cartId, r.lineId, r.quantity)),
	remove: (event) => act(event, removeLineSchema, (cartId, r) => removeLine(cartId, r.lineId)),
	destination: (event) =>
		act(event, knownDestination, (cartId, r) => setDestination(cartId, r.country))
};
