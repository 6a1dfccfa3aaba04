import { json } from '@sveltejs/kit';
import { apiError, orApiError } from '$lib/server/http/api-errors';
import { readJson } from '$lib/server/http/read-json';
import { parseInput } from '$lib/server/errors/parse-input';
import {
	addLine,
	cartIdFrom,
	cartSummary,
	ensureCart,
	removeLine,
	setDestination,
	setQuantity
} from '$lib/server/cart';
import {
	addLineSchema,
	knownDestinationSchema,
	removeLineSchema,
	setQuantitySchema
} from '$lib/cart/cart-schema';
import { COUNTRIES } from '$lib/locale/countries';
import type { RequestEvent, RequestHandler } from './$types';

const NOT_POSTED = 'We do not post to that country yet.';

/**
 * Parses the request first (so bad input never creates a basket), then runs the change and
 * answers with the new summary, or a JSON error the page can show.
 */
const change = (
	event: RequestEvent,
	prepare: (input: Record<string, unknown>) => (cartId: string) => Promise<unknown>
) =>
	orApiError(async () => {
		const run = prepare(await readJson(event.request));
		const { cookies, locals, url } = event;
		const cartId = await ensureCart(cookies, locals.user?.id ?? null, url.protocol === 'https:');
		await run(cartId);
		return json(await cartSummary(cartId));
	});

/** The cart with prices, tax and a shipping estimate for `?country=` (default: saved or home). */
export const GET: RequestHandler = async ({ url, cookies }) => {
	const country = url.searchParams.get('country')?.toUpperCase();
	if (country && !(COUNTRIES as readonly string[]).includes(country)) {
		return apiError(400, NOT_POSTED, { country: ['Choose a country from the list.'] });
	}
	return json(await cartSummary(cartIdFrom(cookies), country));
};

/** Adds a piece: { slug, wood, quantity?, initials?, style? }. */
export const POST: RequestHandler = (event) =>
	change(event, (input) => {
		const line = parseInput(addLineSchema, input);
		return (cartId) => addLine(cartId, line);
	});

/** Changes a quantity { lineId, quantity } or the destination { country }. */
export const PATCH: RequestHandler = (event) =>
	change(event, (input) => {
		if ('country' in input) {
			const { country } = parseInput(knownDestinationSchema(NOT_POSTED), input);
			return (cartId) => setDestination(cartId, country);
		}
		const { lineId, quantity } = parseInput(setQuantitySchema, input);
		return (cartId) => setQuantity(cartId, lineId, quantity);
	});

/** Removes a line { lineId }. */
export const DELETE: RequestHandler = (event) =>
	change(event, (input) => {
		const { lineId } = parseInput(removeLineSchema, input);
		return (cartId) => removeLine(cartId, lineId);
	});
