/**
 * Everything between us and the payment provider for an order: opening and closing the hosted
 * payment session, the buyer's return from it, and the provider's events (webhooks).
 *
 * Events are handled through `eventHandlers`, a map of event type → handler: each handler checks
 * the fields it needs with zod (a malformed event is a 400 with a reason, never a 500), records
 * the event id first so a repeat changes nothing, and does its work in one transaction that is
 * retried on deadlock. Every e-mail the change causes is written to the outbox in that same
 * transaction; refunds and the first try at sending go out only after the commit.
 */
import { and, eq, gt } from 'drizzle-orm';
import { formatRate } from '$lib/locale/money';
import { styleWords } from '$lib/pattern/styles';
import { z } from 'zod';
import { countryName } from '$lib/locale/countries';
import type { Tx } from '../db';
import { transact } from '../db/retry';
import { cartLines, orders, processedEvents } from '../db/schema';
import { stripe, type Stripe } from './stripe';
import type { PricedCart } from '../cart/pricing';
import { forgetCheckoutDetails } from '../cart/checkout-details';
import { takeStock } from '../stock/holds';
import { heldLines, releaseInTx, releaseOrder } from './holds';
import { moveOrder } from './status';
import { queueConfirmation, queuePieceGone, queueReplacedPaid } from './mail';
import { orderById, orderByRef } from './views';
import { queueNewOrderAlert } from './paid-alert';
import { promiseReadyBy, replanQueue } from '../queue/carving-queue';
import { sendQueued } from '../mail/outbox';
import {
	handleRefundEvent,
	refundedChargeObject,
	refundObject,
	type RefundEventObject
} from './refunds';
import { DomainError } from '../errors/domain-error';

// ---------------------------------------------------------------- the hosted payment session

type SessionOrder = { ref: string; holdExpiresAt: Date; priced: PricedCart };

function describe(l: PricedCart['lines'][number]) {
	const p = l.personalisation;
	return p
		? `${l.woodName}, initials ${p.initials}, ${styleWords(p.style)}`
		: `${l.woodName}, ready now`;
}

/**
 * Opens a hosted payment page for a pending order. Amounts come from the server's own pricing
 * (minor units, as the API expects); shipping and tax travel as their own lines so the
 * payment page shows the same breakdown as our cart. The session ends when the hold ends.
 */
export async function createCheckoutSession(
	order: SessionOrder,
	email: string,
	origin: string
): Promise<Stripe.Checkout.Session> {
	const { priced } = order;
	const currency = priced.currency.toLowerCase();
	const item = (name: string, unit_amount: number, quantity = 1, description?: string) => ({
		quantity,
		price_data: {
			currency,
			unit_amount,
			product_data: { name, ...(description ? { description } : {}) }
		}
	});
	const items: Stripe.Checkout.SessionCreateParams.LineItem[] = priced.lines.map((l) =>
		item(l.title, l.unitMinor, l.quantity, describe(l))
	);
	if (priced.shippingMinor > 0)
		items.push(item(`Shipping to ${countryName(priced.country)}`, priced.shippingMinor));
	if (priced.taxMinor > 0)
		items.push(item(`Sales tax (${formatRate(priced.rateBp)})`, priced.taxMinor));
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

/** Ends an open session so it can no longer be paid; ignores ones already over. */
export async function expireCheckoutSession(sessionId: string) {
	try {
		await stripe().checkout.sessions.expire(sessionId);
	} catch {
		// Already completed or expired: the caller asks for the status when that matters.
	}
}

type SessionState = {
	status: 'open' | 'complete' | 'expired' | 'unknown';
	declined: string | null;
};

/** What the payment server says about a session; 'unknown' when it cannot be asked. */
export async function sessionState(sessionId: string): Promise<SessionState> {
	try {
		const s = await stripe().checkout.sessions.retrieve(sessionId, { expand: ['payment_intent'] });
		const pi = s.payment_intent;
		return {
			status: (['open', 'complete', 'expired'] as const).find((k) => k === s.status) ?? 'unknown',
			declined: pi && typeof pi !== 'string' ? (pi.last_payment_error?.message ?? null) : null
		};
	} catch {
		return { status: 'unknown', declined: null };
	}
}

/**
 * The buyer came back from the payment page without paying (cancelled, or gave up after a
 * decline). Ask the payment server first: a session that was paid meanwhile keeps its hold (its
 * payment event is on the way). Otherwise close the session and put the held pieces back. Only
 * an order made from this same basket is touched.
 */
export async function returnUnpaid(ref: string | null, cartId: string | null) {
	if (!ref || !cartId) return { declined: null as string | null, paid: false };
	const order = await orderByRef(ref);
	if (!order || order.cartId !== cartId || order.status !== 'pending')
		return { declined: null, paid: false };
	if (!order.checkoutSessionId) {
		await releaseOrder(order.id);
		return { declined: null, paid: false };
	}
	let state = await sessionState(order.checkoutSessionId);
	if (state.status === 'open') {
		await expireCheckoutSession(order.checkoutSessionId);
		state = { ...(await sessionState(order.checkoutSessionId)), declined: state.declined };
	}
	if (state.status === 'expired') await releaseOrder(order.id);
	// 'complete': paid after all; 'unknown': the sweep releases the hold when its time is up.
	return { declined: state.declined, paid: state.status === 'complete' };
}

// ---------------------------------------------------------------- events

const sessionObject = z.object({
	id: z.string().min(1),
	payment_status: z.string().optional(),
	payment_intent: z
		.union([z.string(), z.object({ id: z.string() })])
		.nullish()
		.transform((p) => (typeof p === 'string' ? p : (p?.id ?? null))),
	client_reference_id: z.string().nullish(),
	metadata: z.object({ orderRef: z.string().optional() }).nullish()
});

function parseObject<T extends z.ZodType>(schema: T, event: Stripe.Event): z.infer<T> {
	const r = schema.safeParse((event.data as { object?: unknown } | undefined)?.object);
	if (r.success) return r.data;
	const issue = r.error.issues[0];
	throw new DomainError(
		400,
		`Event ${event.id} (${event.type}) is missing or has a bad data.object.${issue.path.join('.') || '?'}: ${issue.message}`
	);
}

export type EventResult = { handled: boolean; changed: boolean; outcome?: string };

/**
 * Records an event id inside the caller's transaction; false when it was already recorded (a
 * repeat delivery). A plain insert that ignores the duplicate takes no gap lock first, so
 * parallel deliveries of different events do not deadlock; a parallel delivery of the same
 * event waits for the first and then sees it.
 */
async function firstTime(tx: Tx, event: Stripe.Event): Promise<boolean> {
	const [res] = await tx
		.insert(processedEvents)
		.ignore()
		.values({ id: event.id, type: event.type, processedAt: new Date() });
	return res.affectedRows === 1;
}

async function lockOrderFor(tx: Tx, session: z.infer<typeof sessionObject>) {
	const ref = session.metadata?.orderRef ?? session.client_reference_id ?? undefined;
	const [order] = await tx
		.select()
		.from(orders)
		.where(ref ? eq(orders.ref, ref) : eq(orders.checkoutSessionId, session.id))
		.for('update');
	return order;
}

type PaidOutcome =
	| { kind: 'paid'; orderId: number; mails: number[] }
	| { kind: 'gone' | 'replaced'; orderId: number; paymentIntentId: string | null; mails: number[] }
	| { kind: 'none'; why: string };

/** A later order of the same basket exists: this one was replaced by a second checkout. */
async function replacedByNewer(tx: Tx, order: { id: number; cartId: string | null }) {
	if (!order.cartId) return false;
	const [newer] = await tx
		.select({ id: orders.id })
		.from(orders)
		.where(and(eq(orders.cartId, order.cartId), gt(orders.id, order.id)))
		.limit(1);
	return Boolean(newer);
}

/**
 * Payment completed. In one transaction: record the event, and then either mark the order paid
 * (its pieces are already held), or, when its hold was released before the payment landed, take
 * the pieces again if they are still on the shelf, or else put the order in `piece_gone`. An
 * order that a newer checkout of the same basket replaced is never revived: one basket is
 * charged once, so that payment is recorded on it and refunded. The e-mails each outcome causes
 * are queued in the same transaction.
 */
async function applyPaid(event: Stripe.Event, now: Date, origin: string): Promise<PaidOutcome> {
	const session = parseObject(sessionObject, event);
	if (session.payment_status !== undefined && session.payment_status !== 'paid')
		return { kind: 'none', why: 'not paid yet' };
	return transact(async (tx) => {
		if (!(await firstTime(tx, event))) return { kind: 'none', why: 'repeat' };
		const order = await lockOrderFor(tx, session);
		if (!order) return { kind: 'none', why: 'no such order' };
		if (order.status !== 'pending' && order.status !== 'cancelled')
			return { kind: 'none', why: `order already ${order.status}` };
		const payment = {
			checkoutSessionId: session.id,
			paymentIntentId: session.payment_intent,
			holdExpiresAt: null,
			paidAt: now
		};
		if (order.status === 'cancelled' && (await replacedByNewer(tx, order))) {
			await tx.update(orders).set(payment).where(eq(orders.id, order.id));
			const detail = (await orderById(order.id, tx))!;
			const mail = await queueReplacedPaid(
				tx,
				{ ...detail, refundedMinor: detail.totalMinor },
				origin
			);
			return {
				kind: 'replaced',
				orderId: order.id,
				paymentIntentId: session.payment_intent,
				mails: [mail]
			};
		}
		if (order.status === 'cancelled') {
			const short = await takeStock(
				tx,
				await heldLines(tx, order.id),
				`Taken again for ${order.ref}, paid after its hold lapsed`
			);
			if (short) {
				await moveOrder(
					order.id,
					'piece_gone',
					{ userId: null, why: 'Paid after the hold lapsed; the piece had been sold meanwhile.' },
					tx,
					payment,
					now
				);
				const detail = (await orderById(order.id, tx))!;
				// The refund is asked for right after the commit; without a payment id the owner does it.
				const refundedMinor = session.payment_intent ? detail.totalMinor : 0;
				const mail = await queuePieceGone(tx, { ...detail, refundedMinor }, origin);
				return {
					kind: 'gone',
					orderId: order.id,
					paymentIntentId: session.payment_intent,
					mails: [mail]
				};
			}
		}
		await moveOrder(
			order.id,
			'paid',
			{
				userId: null,
				why:
					order.status === 'cancelled'
						? 'Paid after the hold lapsed; the pieces were still on the shelf.'
						: 'Payment received.'
			},
			tx,
			payment,
			now
		);
		// Dated before the letters are written, so the paid e-mail and the owner's alert state the
		// same ready-by day as every other place.
		await promiseReadyBy(order.id, now, tx);
		if (order.cartId) {
			await tx.delete(cartLines).where(eq(cartLines.cartId, order.cartId));
			// The basket's work is done; the details live on in the order itself.
			await forgetCheckoutDetails(tx, order.cartId);
		}
		const detail = (await orderById(order.id, tx))!;
		const mails = [
			await queueConfirmation(tx, detail, origin),
			...(await queueNewOrderAlert(tx, order.id, origin))
		];
		return { kind: 'paid', orderId: order.id, mails };
	});
}

/**
 * A payment that must go back in full (the piece is gone, or a newer checkout replaced this
 * one): one full refund through the provider, keyed so a retry never refunds twice. The buyer's
 * letter was queued with the change. A `piece_gone` order stays for the owner, who may offer to
 * carve another or close it as refunded.
 */
async function refundWhole(
	orderId: number,
	paymentIntentId: string | null,
	reason: 'piece_gone' | 'replaced'
) {
	const order = await orderById(orderId);
	if (!order || !paymentIntentId) return;
	try {
		await stripe().refunds.create(
			{ payment_intent: paymentIntentId, metadata: { orderRef: order.ref, reason } },
			{ idempotencyKey: `${reason === 'piece_gone' ? 'piece-gone' : reason}-${order.ref}` }
		);
		await transact((tx) =>
			tx
				.update(orders)
				.set({ refundedMinor: order.totalMinor })
				.where(and(eq(orders.id, orderId), eq(orders.paymentIntentId, paymentIntentId)))
		);
	} catch (err) {
		// The owner sees the paid order with nothing refunded and refunds by hand.
		console.error('Automatic refund failed', order.ref, reason, err);
	}
}

async function onSessionCompleted(event: Stripe.Event, origin: string): Promise<EventResult> {
	const outcome = await applyPaid(event, new Date(), origin);
	if (outcome.kind === 'none') return { handled: true, changed: false, outcome: outcome.why };
	await sendQueued(outcome.mails);
	if (outcome.kind === 'gone' || outcome.kind === 'replaced') {
		const why = outcome.kind === 'gone' ? 'piece_gone' : 'replaced';
		await refundWhole(outcome.orderId, outcome.paymentIntentId, why);
		return { handled: true, changed: true, outcome: why };
	}
	// The queue changed: every queued order's plan again (never failing the payment).
	await replanQueue();
	return { handled: true, changed: true, outcome: 'paid' };
}

/** Session expired unpaid: record the event and release the hold, in one transaction. */
async function onSessionExpired(event: Stripe.Event): Promise<EventResult> {
	const session = parseObject(sessionObject, event);
	const changed = await transact(async (tx) => {
		if (!(await firstTime(tx, event))) return false;
		const order = await lockOrderFor(tx, session);
		if (!order) return false;
		return releaseInTx(tx, order.id, 'The payment page expired unpaid.');
	});
	return { handled: true, changed };
}

/** A refund settled or changed at the provider: keep the order's refunded figures in step. */
async function onRefundEvent(event: Stripe.Event): Promise<EventResult> {
	const e: RefundEventObject =
		event.type === 'charge.refunded'
			? { type: 'charge.refunded', object: parseObject(refundedChargeObject, event) }
			: { type: 'refund.updated', object: parseObject(refundObject, event) };
	const changed = await transact(async (tx) => {
		if (!(await firstTime(tx, event))) return false;
		return handleRefundEvent(e, tx);
	});
	// Refunded in full, an order leaves the carving queue.
	if (changed) await replanQueue();
	return { handled: true, changed };
}

type Handler = (event: Stripe.Event, origin: string) => Promise<EventResult>;

/** Event type → handler. Add a type here (refunds, disputes) and the webhook route handles it. */
export const eventHandlers: Partial<Record<Stripe.Event['type'], Handler>> = {
	'checkout.session.completed': onSessionCompleted,
	'checkout.session.async_payment_succeeded': onSessionCompleted,
	'checkout.session.expired': onSessionExpired,
	'charge.refunded': onRefundEvent,
	'refund.updated': onRefundEvent
};

/**
 * Acts on one verified payment event. Unknown types are accepted and ignored (200); a known type
 * with missing fields throws a DomainError 400 saying which field is wrong.
 */
export async function handlePaymentEvent(
	event: Stripe.Event,
	origin: string
): Promise<EventResult> {
	const handler = eventHandlers[event.type];
	if (!handler) return { handled: false, changed: false };
	return handler(event, origin);
}
