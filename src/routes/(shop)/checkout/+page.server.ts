import { redirect } from '@sveltejs/kit';
import { cartIdFrom, cartSummary } from '$lib/server/cart';
import { checkoutDetailsFor } from '$lib/server/cart/checkout-details';
import { placeOrder } from '$lib/server/orders/place';
import { isFailure, orFail } from '$lib/server/errors/form-answer';
import { checkoutSchema } from '$lib/cart/checkout-schema';
import { COUNTRIES } from '$lib/locale/countries';
import { REGION_EXAMPLE, regionsFor } from '$lib/locale/regions';
import type { Actions, PageServerLoad } from './$types';
import { formFail, parseForm } from '$lib/forms/parse-form';
import { takeAll, tryAgainIn } from '$lib/server/http/rate-limit';
import { throttles } from '$lib/server/http/throttles';

export const load: PageServerLoad = async ({ cookies, locals, setHeaders }) => {
	const cartId = cartIdFrom(cookies);
	const summary = await cartSummary(cartId);
	if (summary.lines.length === 0) redirect(303, '/cart');
	// Back from the payment page unpaid: the form comes back as this basket last sent it. The
	// country is the basket's destination, which the shipping charge shown is priced for.
	const saved = await checkoutDetailsFor(cartId);
	const a = saved?.address;
	// The page carries a name and an address: no shared cache keeps it.
	if (saved) setHeaders({ 'cache-control': 'private, no-store' });
	return {
		summary,
		countries: COUNTRIES,
		// For the region box's suggestions; any of the names or codes is accepted.
		regions: Object.fromEntries(COUNTRIES.map((c) => [c, regionsFor(c)])),
		regionExamples: REGION_EXAMPLE,
		buyer: {
			name: saved?.name ?? locals.user?.name ?? '',
			email: saved?.email ?? locals.user?.email ?? '',
			line1: a?.line1 ?? '',
			line2: a?.line2 ?? '',
			city: a?.city ?? '',
			region: a?.region ?? '',
			postcode: a?.postcode ?? '',
			giftNote: saved?.giftNote ?? ''
		}
	};
};

export const actions: Actions = {
	default: async ({ request, cookies, locals, url, getClientAddress }) => {
		const parsed = await parseForm(request, checkoutSchema);
		if (!parsed.ok) return parsed.failure;
		const { values } = parsed;

		const cartId = cartIdFrom(cookies);
		if (!cartId) return formFail(409, 'Your basket is empty.', { values });

		// Throttle: pieces held per basket and per client address (see $lib/server/http/throttles).
		const held = await takeAll([
			[throttles.checkoutBasket, cartId],
			[throttles.checkoutAddress, getClientAddress()]
		]);
		if (!held.ok) {
			locals.retryAfterS = held.retryAfterS;
			return formFail(429, tryAgainIn(held.retryAfterS), { values });
		}

		const placed = await orFail(
			() => placeOrder(cartId, parsed.data, locals.user?.id ?? null, url.origin),
			{ values }
		);
		if (isFailure(placed)) return placed;
		redirect(303, placed.paymentUrl);
	}
};
