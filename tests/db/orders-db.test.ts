/**
 * Orders against the real MariaDB database `npm test` prepared (not a mock): stock held by
 * the checkout transaction, never below zero under two concurrent checkouts of the last piece,
 * released on cancel/expiry, and payment events applied once.
 */
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import { testPiece, testStock, testWood } from '../helpers/fixtures';
import { addLine } from '$lib/server/cart';
import { createPendingOrder } from '$lib/server/orders/place';
import { releaseExpiredHolds, releaseOrder } from '$lib/server/orders/holds';
import { handlePaymentEvent } from '$lib/server/orders/payment';
import type { Stripe } from '$lib/server/orders/stripe';

type Ev = {
	eventId: string;
	type: string;
	sessionId: string;
	ref?: string;
	paymentIntentId?: string;
};
/** A verified event as the SDK hands it over (only the fields the handlers read). */
async function deliver(e: Ev) {
	const event = {
		id: e.eventId,
		type: e.type,
		data: {
			object: {
				id: e.sessionId,
				payment_status: e.type === 'checkout.session.completed' ? 'paid' : 'unpaid',
				payment_intent: e.paymentIntentId ?? null,
				metadata: e.ref ? { orderRef: e.ref } : {}
			}
		}
	} as unknown as Stripe.Event;
	return (await handlePaymentEvent(event, 'http://localhost')).changed;
}
const markPaid = deliver;
const markExpired = deliver;
import type { CheckoutInput } from '$lib/cart/checkout-schema';
import { queueOutlook } from '$lib/server/queue/carving-queue';
import { readyByFor } from '$lib/queue/carving-queue';
import { DomainError } from '$lib/server/errors/domain-error';

const tag = `t${process.pid}${Date.now() % 100000}`;
let pieceId = 0;
let woodId = 0;

const buyer: CheckoutInput = {
	name: 'Test Buyer',
	email: 'test-buyer@example.test',
	line1: '1 Test Lane',
	city: 'Boulder',
	region: 'CO',
	postcode: '80302',
	country: 'US'
};

async function newCart(quantity = 1, initials?: string) {
	const id = crypto.randomUUID();
	const now = new Date();
	await db.insert(s.carts).values({ id, createdAt: now, updatedAt: now });
	await addLine(id, { slug: `${tag}-piece`, wood: `${tag}-wood`, quantity, initials });
	return id;
}

async function shelf() {
	const [row] = await db
		.select({ q: s.stock.quantity })
		.from(s.stock)
		.where(
			and(eq(s.stock.pieceId, pieceId), eq(s.stock.woodId, woodId), eq(s.stock.place, 'workshop'))
		);
	return row.q;
}

async function setShelf(q: number) {
	await db
		.update(s.stock)
		.set({ quantity: q })
		.where(and(eq(s.stock.pieceId, pieceId), eq(s.stock.woodId, woodId)));
}

beforeAll(async () => {
	woodId = await testWood(`${tag}-wood`, { name: 'Test basswood', priceAddOnMinor: 250 });
	pieceId = await testPiece(`${tag}-piece`, [woodId], {
		title: 'Test ornament',
		kind: 'ornament',
		personalisable: true,
		basePriceMinor: 1400
	});
	await testStock(pieceId, woodId, 2);
});

afterAll(async () => {
	// Leave the shared test database as other tests expect it: our rows only.
	const ours = await db
		.select({ id: s.orders.id })
		.from(s.orders)
		.where(eq(s.orders.email, buyer.email));
	for (const o of ours) await db.delete(s.orders).where(eq(s.orders.id, o.id));
});

describe('creating an order from a cart', () => {
	it('prices from the database and holds ready-made stock by taking it off the shelf', async () => {
		await setShelf(2);
		const cart = await newCart(2);
		const order = await createPendingOrder(cart, buyer, null);
		// 2 × (14.00 + 2.50 wood) = 33.00, exact in minor units.
		expect(order.priced.subtotalMinor).toBe(3300);
		expect(await shelf()).toBe(0);
		const [row] = await db.select().from(s.orders).where(eq(s.orders.id, order.id));
		expect(row.status).toBe('pending');
		// The hold ends when the payment session does (DATETIME keeps whole seconds).
		expect(Math.floor(row.holdExpiresAt!.getTime() / 1000)).toBe(
			Math.floor(order.holdExpiresAt.getTime() / 1000)
		);

		expect(await releaseOrder(order.id)).toBe(true);
		expect(await shelf()).toBe(2);
		// Releasing twice does not put pieces back twice.
		expect(await releaseOrder(order.id)).toBe(false);
		expect(await shelf()).toBe(2);
	});

	it('lets only one of two concurrent checkouts hold the last piece', async () => {
		await setShelf(1);
		const [a, b] = [await newCart(1), await newCart(1)];
		const results = await Promise.allSettled([
			createPendingOrder(a, buyer, null),
			createPendingOrder(b, buyer, null)
		]);
		const ok = results.filter((r) => r.status === 'fulfilled');
		const failed = results.filter((r): r is PromiseRejectedResult => r.status === 'rejected');
		expect(ok).toHaveLength(1);
		expect(failed).toHaveLength(1);
		expect(failed[0].reason).toBeInstanceOf(DomainError);
		expect((failed[0].reason as DomainError).code).toBe('stock');
		expect(await shelf()).toBe(0);
		// The losing cart left nothing half-written.
		const loser = results[0].status === 'rejected' ? a : b;
		expect(await db.select().from(s.orders).where(eq(s.orders.cartId, loser))).toHaveLength(0);
		await releaseOrder((ok[0] as PromiseFulfilledResult<{ id: number }>).value.id);
		expect(await shelf()).toBe(1);
	});

	it('refuses a stale total and writes nothing', async () => {
		await setShelf(1);
		const cart = await newCart(1);
		await expect(createPendingOrder(cart, { ...buyer, seenTotal: 1 }, null)).rejects.toMatchObject({
			code: 'price'
		});
		expect(await shelf()).toBe(1);
		expect(await db.select().from(s.orders).where(eq(s.orders.cartId, cart))).toHaveLength(0);
	});

	it('refuses an empty cart', async () => {
		const id = crypto.randomUUID();
		await db.insert(s.carts).values({ id, createdAt: new Date(), updatedAt: new Date() });
		await expect(createPendingOrder(id, buyer, null)).rejects.toMatchObject({ code: 'empty' });
	});

	it('makes personalised lines to order, dated as the piece page dates that layout', async () => {
		await setShelf(0);
		const cart = await newCart(1, 'ab');
		const now = new Date('2026-03-02T10:00:00Z');
		const order = await createPendingOrder(cart, buyer, null, now);
		const [row] = await db.select().from(s.orders).where(eq(s.orders.id, order.id));
		const [line] = await db.select().from(s.orderLines).where(eq(s.orderLines.orderId, order.id));
		expect(line.fromStock).toBe(false);
		// The piece page's sum: this layout's minutes joining the queue as it stands (its own
		// rules are checked against hand-worked calendars in carving-queue.test.ts).
		const q = await queueOutlook(now);
		expect(row.readyBy).toBe(
			readyByFor(
				q.minutesAhead,
				line.personalisation!.estimateMinutes!,
				q.schedule,
				q.today,
				q.extraDaysOff
			)
		);
		// Carving, two finishing days and a packing day lie between (the default week).
		expect(row.readyBy! > '2026-03-04').toBe(true);
		// The JSON column type parses MariaDB's text on read: an object, not a string.
		const snap = line.personalisation!;
		expect(snap.initials).toBe('AB');
		expect(snap.chipCount).toBeGreaterThan(0);
		await releaseOrder(order.id);
	});
});

describe('payment events', () => {
	it('marks paid once, keeps the sale, empties the cart; a repeat changes nothing', async () => {
		await setShelf(1);
		const cart = await newCart(1);
		const order = await createPendingOrder(cart, buyer, null);
		await db
			.update(s.orders)
			.set({ checkoutSessionId: `cs_${tag}_1` })
			.where(eq(s.orders.id, order.id));
		const event = {
			eventId: `evt_${tag}_1`,
			type: 'checkout.session.completed',
			sessionId: `cs_${tag}_1`,
			ref: order.ref,
			paymentIntentId: 'pi_1'
		};

		expect(await markPaid(event)).toBe(true);
		expect(await markPaid(event)).toBe(false);
		const [row] = await db.select().from(s.orders).where(eq(s.orders.id, order.id));
		expect(row.status).toBe('paid');
		expect(row.paymentIntentId).toBe('pi_1');
		expect(await shelf()).toBe(0); // the hold became the sale
		expect(await db.select().from(s.cartLines).where(eq(s.cartLines.cartId, cart))).toHaveLength(0);
		expect(
			await db.select().from(s.processedEvents).where(eq(s.processedEvents.id, event.eventId))
		).toHaveLength(1);
		// An expiry arriving after payment does not undo it.
		expect(
			await markExpired({ ...event, eventId: `evt_${tag}_1x`, type: 'checkout.session.expired' })
		).toBe(false);
		expect(await shelf()).toBe(0);
	});

	it('releases the hold when the session expires, and when a hold outlives its session', async () => {
		await setShelf(1);
		const order = await createPendingOrder(await newCart(1), buyer, null);
		await db
			.update(s.orders)
			.set({ checkoutSessionId: `cs_${tag}_2` })
			.where(eq(s.orders.id, order.id));
		expect(await shelf()).toBe(0);
		expect(
			await markExpired({
				eventId: `evt_${tag}_2`,
				type: 'checkout.session.expired',
				sessionId: `cs_${tag}_2`,
				ref: order.ref
			})
		).toBe(true);
		expect(await shelf()).toBe(1);
		const [row] = await db.select().from(s.orders).where(eq(s.orders.id, order.id));
		expect(row.status).toBe('cancelled');
		// The hold and its release are in the piece's stock history, each naming the order.
		const history = await db
			.select({ delta: s.stockAdjustments.delta, reason: s.stockAdjustments.reason })
			.from(s.stockAdjustments)
			.where(and(eq(s.stockAdjustments.pieceId, pieceId), eq(s.stockAdjustments.woodId, woodId)));
		const ofOrder = history.filter((h) => h.reason.includes(order.ref));
		expect(ofOrder.map((h) => h.delta).sort()).toEqual([-1, 1]);

		const late = await createPendingOrder(
			await newCart(1),
			buyer,
			null,
			new Date(Date.now() - 3 * 3600_000)
		);
		expect(await shelf()).toBe(0);
		expect(await releaseExpiredHolds()).toBeGreaterThanOrEqual(1);
		expect(await shelf()).toBe(1);
		const [lateRow] = await db.select().from(s.orders).where(eq(s.orders.id, late.id));
		expect(lateRow.status).toBe('cancelled');
	});
});
