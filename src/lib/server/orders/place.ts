/**
 * Placing an order: the one call the checkout makes. Prices the basket on the server, holds
 * finished pieces, opens the payment session, and undoes the order if the session cannot open.
 */
import { randomInt } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import type { Tx } from '../db';
import { transact } from '../db/retry';
import { orderLines, orders } from '../db/schema';
import { addressOf } from './address';
import { priceCart, type PricedCart } from '../cart/pricing';
import { carvedMinutes, readyByNow } from '../queue/carving-queue';
import { saveCheckoutDetails } from '../cart/checkout-details';
import { lockCart } from '../cart/lock';
import { confirmedAccountFor } from '../auth/guest-orders';
import type { CheckoutInput } from '$lib/cart/checkout-schema';
import { takeStock } from '../stock/holds';
import { releaseExpiredHolds, releaseInTx, releaseOrder } from './holds';
import { createCheckoutSession, expireCheckoutSession, sessionState } from './payment';
import { stripe } from './stripe';
import { DomainError } from '../errors/domain-error';

/** Stripe lets a Checkout Session live 30 min to 24 h; a little over 30 covers clock drift. */
export const HOLD_MINUTES = 35;

const REF_ALPHABET = '23456789ABCDEFGHJKMNPQRSTVWXYZ'; // no 0/O, 1/I/L, U: easy to read aloud

export function newOrderRef(): string {
	let s = '';
	for (let i = 0; i < 6; i++) s += REF_ALPHABET[randomInt(REF_ALPHABET.length)];
	return `CS-${s}`;
}

export type PendingOrder = {
	id: number;
	ref: string;
	holdExpiresAt: Date;
	priced: PricedCart;
	/** Payment sessions of orders this one replaced; closed once the new order is committed. */
	replacedSessions: string[];
};

/** A fresh order reference no order holds yet. */
export async function uniqueRef(tx: Tx) {
	let ref = newOrderRef();
	for (let i = 0; i < 5; i++) {
		const [clash] = await tx.select({ id: orders.id }).from(orders).where(eq(orders.ref, ref));
		if (!clash) break;
		ref = newOrderRef();
	}
	return ref;
}

/**
 * Turns the basket into a pending order in one transaction: every price, tax and shipping charge
 * recomputed from the database, finished pieces held by taking them off the shelf. A basket has
 * at most one pending order: the cart row is locked, and an earlier pending order of the same
 * basket (a double click, the back button) is cancelled and its pieces put back first. The
 * earlier orders are read with a locking read: a plain one answers from the transaction's
 * snapshot and would miss a payment session attached to them a moment ago, which then would
 * never be closed.
 */
export async function createPendingOrder(
	cartId: string,
	buyer: CheckoutInput,
	userId: string | null,
	now = new Date()
): Promise<PendingOrder> {
	return transact(async (tx) => {
		if (!(await lockCart(tx, cartId)))
			throw new DomainError(409, 'Your basket is empty.', { code: 'empty' });

		const earlier = await tx
			.select({ id: orders.id, sessionId: orders.checkoutSessionId })
			.from(orders)
			.where(and(eq(orders.cartId, cartId), eq(orders.status, 'pending')))
			.for('update');
		for (const o of earlier) {
			await releaseInTx(tx, o.id, 'The same basket was sent to checkout again.');
		}

		const priced = await priceCart(cartId, buyer.country, tx);
		if (priced.lines.length === 0)
			throw new DomainError(409, 'Your basket is empty.', { code: 'empty' });
		if (!priced.shippingKnown)
			throw new DomainError(409, priced.problems.at(-1)!.message, { code: 'rates' });
		const blocking = priced.problems.filter((p) => p.lineId !== 0);
		if (blocking.length)
			throw new DomainError(409, blocking.map((p) => p.message).join(' '), { code: 'stock' });
		if (buyer.seenTotal !== undefined && buyer.seenTotal !== priced.totalMinor) {
			throw new DomainError(
				409,
				'The total has changed since you opened this page. Please check the new total and pay again.',
				{ code: 'price' }
			);
		}

		const ref = await uniqueRef(tx);
		const short = await takeStock(
			tx,
			priced.lines.filter((l) => l.fromStock),
			`Held for ${ref} while the buyer pays`
		);
		if (short) {
			const line = priced.lines.find(
				(l) => l.pieceId === short.pieceId && l.woodId === short.woodId
			)!;
			throw new DomainError(409, `${line.title} in ${line.woodName} has just sold out.`, {
				code: 'stock'
			});
		}

		const holdExpiresAt = new Date(now.getTime() + HOLD_MINUTES * 60_000);
		const [{ id }] = await tx
			.insert(orders)
			.values({
				ref,
				// A guest order with an address a confirmed account has proven joins that account.
				userId: userId ?? (await confirmedAccountFor(tx, buyer.email)),
				cartId,
				email: buyer.email,
				buyerName: buyer.name,
				address: addressOf(buyer),
				giftNote: buyer.giftNote || null,
				currency: priced.currency,
				subtotalMinor: priced.subtotalMinor,
				shippingMinor: priced.shippingMinor,
				taxMinor: priced.taxMinor,
				totalMinor: priced.totalMinor,
				status: 'pending',
				// The date the basket and checkout showed; given again from the queue once paid.
				readyBy: await readyByNow(carvedMinutes(priced.lines), now, tx),
				holdExpiresAt,
				createdAt: now
			})
			.$returningId();
		await tx.insert(orderLines).values(
			priced.lines.map((l) => ({
				orderId: id,
				pieceId: l.pieceId,
				woodId: l.woodId,
				title: l.title,
				woodName: l.woodName,
				quantity: l.quantity,
				unitPriceMinor: l.unitMinor,
				lineTotalMinor: l.totalMinor,
				fromStock: l.fromStock,
				personalisation: l.personalisation
			}))
		);
		const replacedSessions = earlier.flatMap((o) => (o.sessionId ? [o.sessionId] : []));
		return { id, ref, holdExpiresAt, priced, replacedSessions };
	});
}

/** Links the session to the order; false when the order stopped being pending meanwhile. */
async function attachCheckoutSession(orderId: number, sessionId: string): Promise<boolean> {
	return transact(async (tx) => {
		const [res] = await tx
			.update(orders)
			.set({ checkoutSessionId: sessionId })
			.where(and(eq(orders.id, orderId), eq(orders.status, 'pending')));
		return res.affectedRows === 1;
	});
}

const PAYMENT_DOWN =
	'The payment service did not answer. Nothing was charged; please try again in a minute.';

/**
 * Closes the payment page of an order this checkout replaced, before a new one is handed out:
 * one basket, one payable page. A page already paid is left to its payment event, which
 * refunds it (see `applyPaid`); a page the provider cannot confirm closed stops the checkout.
 */
async function closeReplacedSession(sessionId: string) {
	try {
		await stripe().checkout.sessions.expire(sessionId);
		return;
	} catch {
		// Refused (already over) or not answered: ask what state it is in.
	}
	const { status } = await sessionState(sessionId);
	if (status !== 'expired' && status !== 'complete')
		throw new DomainError(503, PAYMENT_DOWN, { code: 'payment' });
}

/**
 * The checkout: a pending order with its pieces held, and the payment page to send the buyer
 * to. Throws a DomainError (with a message for the buyer) when it cannot go ahead; nothing is left
 * held when it does.
 */
export async function placeOrder(
	cartId: string,
	buyer: CheckoutInput,
	userId: string | null,
	origin: string,
	now = new Date()
): Promise<{ ref: string; paymentUrl: string }> {
	// Kept against the basket, so a buyer who comes back unpaid finds the form filled.
	await saveCheckoutDetails(
		cartId,
		{
			name: buyer.name,
			email: buyer.email,
			address: addressOf(buyer),
			giftNote: buyer.giftNote || null
		},
		now
	);
	// Pieces held by checkouts that were never finished go back on the shelf first.
	await releaseExpiredHolds(now);
	const order = await createPendingOrder(cartId, buyer, userId, now);
	try {
		for (const s of order.replacedSessions) await closeReplacedSession(s);
	} catch (err) {
		await releaseOrder(order.id, 'An earlier payment page could not be closed.');
		throw err;
	}

	let session;
	try {
		session = await createCheckoutSession(order, buyer.email, origin);
	} catch {
		await releaseOrder(order.id, 'The payment page could not be opened.');
		throw new DomainError(503, PAYMENT_DOWN, { code: 'payment' });
	}
	if (!(await attachCheckoutSession(order.id, session.id))) {
		// The same basket was sent again while this session was being opened: that one wins.
		await expireCheckoutSession(session.id);
		throw new DomainError(
			409,
			'This basket was sent to checkout again in another window; please use that one.'
		);
	}
	if (!session.url) {
		await releaseOrder(order.id, 'The payment page could not be opened.');
		await expireCheckoutSession(session.id);
		throw new DomainError(503, 'The payment page could not be opened. Nothing was charged.', {
			code: 'payment'
		});
	}
	return { ref: order.ref, paymentUrl: session.url };
}
