import { markExpired, markPaid, orderById } from './orders';
import { sendConfirmation } from './order-mail';
import type { Stripe } from './payments';
import { isDuplicateKey, transact } from './db/retry';
import { processedEvents } from './db/schema';
import { handleRefundEvent } from './orders/refunds';
import { afterOrderPaid } from './orders/paid-alert';

const REFUND_EVENTS = new Set(['charge.refunded', 'refund.updated']);

/** Records the event id and applies a refund event in one transaction; a repeat does nothing. */
async function applyRefundEvent(event: Stripe.Event) {
	try {
		return await transact(async (tx) => {
			await tx
				.insert(processedEvents)
				.values({ id: event.id, type: event.type, processedAt: new Date() });
			return handleRefundEvent(event, tx);
		});
	} catch (err) {
		if (isDuplicateKey(err)) return false;
		throw err;
	}
}

/**
 * Acts on one verified payment event. Database changes happen in one transaction inside
 * `markPaid` / `markExpired` (which also record the event id, so a repeat does nothing);
 * the e-mail goes out only after that commit, and only the first time.
 */
export async function handlePaymentEvent(event: Stripe.Event, origin: string) {
	if (REFUND_EVENTS.has(event.type)) {
		return { handled: true as const, changed: await applyRefundEvent(event) };
	}
	if (event.type !== 'checkout.session.completed' && event.type !== 'checkout.session.expired') {
		return { handled: false as const };
	}
	const session = event.data.object;
	const base = {
		eventId: event.id,
		type: event.type,
		sessionId: session.id,
		ref: session.metadata?.orderRef ?? session.client_reference_id ?? undefined
	};
	if (event.type === 'checkout.session.expired') {
		return { handled: true as const, changed: await markExpired(base) };
	}
	if (session.payment_status !== 'paid') return { handled: true as const, changed: false };
	const paymentIntentId =
		typeof session.payment_intent === 'string'
			? session.payment_intent
			: (session.payment_intent?.id ?? null);
	const orderId = await markPaid({ ...base, paymentIntentId });
	if (orderId !== null) {
		const order = await orderById(orderId);
		if (order) {
			try {
				await sendConfirmation(order, origin);
			} catch (err) {
				// The payment is recorded; a failed e-mail must not make the provider resend the event.
				console.error('confirmation e-mail failed', order.ref, err);
			}
		}
		await afterOrderPaid(orderId, origin);
	}
	return { handled: true as const, changed: orderId !== null };
}
