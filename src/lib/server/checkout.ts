import { stripe, type Stripe } from './payments';
import { countryName } from '$lib/shipping';
import type { PricedCart } from './pricing';

type PendingOrder = { id: number; ref: string; holdExpiresAt: Date; priced: PricedCart };

function describe(l: PricedCart['lines'][number]) {
	const p = l.personalisation;
	return p
		? `${l.woodName}, initials ${p.initials}, ${p.style} rosette`
		: `${l.woodName}, ready now`;
}

/**
 * Opens a hosted payment page for a pending order. Amounts come from the server's own pricing
 * (minor units, as the API expects); shipping and tax travel as their own lines so the
 * payment page shows the same breakdown as our cart. The session ends when the hold ends.
 */
export async function createCheckoutSession(
	order: PendingOrder,
	email: string,
	origin: string
): Promise<Stripe.Checkout.Session> {
	const { priced } = order;
	const currency = priced.currency.toLowerCase();
	const items: Stripe.Checkout.SessionCreateParams.LineItem[] = priced.lines.map((l) => ({
		quantity: l.quantity,
		price_data: {
			currency,
			unit_amount: l.unitMinor,
			product_data: { name: l.title, description: describe(l) }
		}
	}));
	if (priced.shippingMinor > 0) {
		items.push({
			quantity: 1,
			price_data: {
				currency,
				unit_amount: priced.shippingMinor,
				product_data: { name: `Shipping to ${countryName(priced.country)}` }
			}
		});
	}
	if (priced.taxMinor > 0) {
		items.push({
			quantity: 1,
			price_data: {
				currency,
				unit_amount: priced.taxMinor,
				product_data: { name: `Sales tax (${(priced.rateBp / 100).toFixed(2)} %)` }
			}
		});
	}
	return stripe().checkout.sessions.create({
		mode: 'payment',
		line_items: items,
		customer_email: email,
		client_reference_id: order.ref,
		metadata: { orderRef: order.ref },
		payment_intent_data: { metadata: { orderRef: order.ref } },
		success_url: `${origin}/checkout/done?session_id={CHECKOUT_SESSION_ID}`,
		cancel_url: `${origin}/cart?cancelled=1&order=${encodeURIComponent(order.ref)}`,
		expires_at: Math.floor(order.holdExpiresAt.getTime() / 1000)
	});
}

/** Ends an open session when the buyer comes back without paying; ignores ones already over. */
export async function expireCheckoutSession(sessionId: string) {
	try {
		await stripe().checkout.sessions.expire(sessionId);
	} catch {
		// Already completed or expired, or the stand-in lacks the call: the hold is released anyway.
	}
}

/** The card error from the last attempt on a session, if there was one (e.g. a decline). */
export async function lastPaymentError(sessionId: string): Promise<string | null> {
	try {
		const s = await stripe().checkout.sessions.retrieve(sessionId, { expand: ['payment_intent'] });
		const pi = s.payment_intent;
		return pi && typeof pi !== 'string' ? (pi.last_payment_error?.message ?? null) : null;
	} catch {
		return null;
	}
}
