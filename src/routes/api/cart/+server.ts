import { json } from '@sveltejs/kit';
import { apiError } from '$lib/server/http/api-errors';
import { fieldErrors, type FieldErrors } from '$lib/forms/parse-form';
import {
	addLine,
	CartError,
	cartIdFrom,
	cartSummary,
	ensureCart,
	removeLine,
	setDestination,
	setQuantity
} from '$lib/server/cart';
import {
	addLineSchema,
	destinationSchema,
	removeLineSchema,
	setQuantitySchema
} from '$lib/cart/cart-schema';
import { COUNTRIES } from '$lib/locale/countries';
import { readJsonObject } from '$lib/server/http/body-limit';
import type { RequestEvent, RequestHandler } from './$types';

const knownCountry = (c: string) => (COUNTRIES as readonly string[]).includes(c);

/**
 * Parses the request first (so bad input never creates a basket), then runs the change and
 * answers with the new summary, or a JSON error the page can show.
 */
async function change(
	event: RequestEvent,
	prepare: (input: Record<string, unknown>) => (cartId: string) => Promise<unknown>
) {
	const input = await readJsonObject(event.request);
	if (!input.ok) return apiError(input.status, input.message);
	try {
		const run = prepare(input.value);
		const cartId = await ensureCart(
			event.cookies,
			event.locals.user?.id ?? null,
			event.url.protocol === 'https:'
		);
		await run(cartId);
		return json(await cartSummary(cartId));
	} catch (err) {
		if (err instanceof CartError) return apiError(err.status, err.message, err.fields);
		if (err instanceof InputError) return apiError(400, err.message, err.fields);
		throw err;
	}
}

class InputError extends Error {
	constructor(public fields: FieldErrors) {
		super(Object.values(fields)[0]?.[0] ?? 'Check the request.');
	}
}

function parse<T>(
	schema: {
		safeParse: (
			v: unknown
		) => { success: true; data: T } | { success: false; error: import('zod').ZodError };
	},
	v: unknown
): T {
	const r = schema.safeParse(v);
	if (!r.success) throw new InputError(fieldErrors(r.error));
	return r.data;
}

/** The cart with prices, tax and a shipping estimate for `?country=` (default: saved or home). */
export const GET: RequestHandler = async ({ url, cookies }) => {
	const country = url.searchParams.get('country')?.toUpperCase();
	if (country && !knownCountry(country)) {
		return apiError(400, 'We do not post to that country yet.', {
			country: ['Choose a country from the list.']
		});
	}
	return json(await cartSummary(cartIdFrom(cookies), country));
};

/** Adds a piece: { slug, wood, quantity?, initials?, style? }. */
export const POST: RequestHandler = (event) =>
	change(event, (input) => {
		const line = parse(addLineSchema, input);
		return (cartId) => addLine(cartId, line);
	});

/** Changes a quantity { lineId, quantity } or the destination { country }. */
export const PATCH: RequestHandler = (event) =>
	change(event, (input) => {
		if ('country' in input) {
			const { country } = parse(destinationSchema, input);
			if (!knownCountry(country))
				throw new InputError({ country: ['We do not post to that country yet.'] });
			return (cartId) => setDestination(cartId, country);
		}
		const { lineId, quantity } = parse(setQuantitySchema, input);
		return (cartId) => setQuantity(cartId, lineId, quantity);
	});

/** Removes a line { lineId }. */
export const DELETE: RequestHandler = (event) =>
	change(event, (input) => {
		const { lineId } = parse(removeLineSchema, input);
		return (cartId) => removeLine(cartId, lineId);
	});
