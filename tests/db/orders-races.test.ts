/**
 * Orders under the races a busy weekend brings, against the real MariaDB and the payment
 * stand-in (which speaks the provider's API through the official SDK): a payment that lands
 * after its hold was released, many payment events at once, one event many times, one basket
 * sent many times, and moves the status table does not allow. "Never sell a piece twice" and
 * "stock never below zero" are common practice for a shop holding finished stock.
 */
import Stripe from 'stripe';
import { and, eq, inArray } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import { shelfCount, testCart, testPiece, testStock, testWood } from '../helpers/fixtures';
import { config } from '$lib/server/config';
import { createPendingOrder, placeOrder } from '$lib/server/orders/place';
import { releaseExpiredHolds } from '$lib/server/orders/holds';
import { moveOrder, orderHistoryOf } from '$lib/server/orders/status';
import { stripe } from '$lib/server/orders/stripe';
import { orderStatuses, nextStatuses } from '$lib/orders/status';
import type { CheckoutInput } from '$lib/cart/checkout-schema';
import { POST } from '../../src/routes/api/payments/webhook/+server';
import { DomainError } from '$lib/server/errors/domain-error';

const tag = `r${process.pid}${Date.now() % 100000}`;
const sdk = new Stripe('sk_test_unused');
const inbox = `http://127.0.0.1:${config.mail.inboxPort}`;
let pieceId = 0;
let woodId = 0;

const buyer = (n: string | number): CheckoutInput => ({
	name: `Race Buyer ${n}`,
	email: `race-${tag}-${n}@example.test`.toLowerCase(),
	line1: '1 Test Lane',
	city: 'Linden Ford',
	region: 'VT',
	postcode: '05002',
	country: 'US'
});

const newCart = () => testCart(tag);
const shelf = () => shelfCount(pieceId, woodId);
const setShelf = (q: number) =>
	db
		.update(s.stock)
		.set({ quantity: q })
		.where(and(eq(s.stock.pieceId, pieceId), eq(s.stock.woodId, woodId)));

const orderRow = async (ref: string) =>
	(await db.select().from(s.orders).where(eq(s.orders.ref, ref)))[0];

/** Signs with the SDK's own test signer and posts to the webhook route. */
async function deliver(event: object) {
	const payload = JSON.stringify(event);
	const header = sdk.webhooks.generateTestHeaderString({
		payload,
		secret: config.stripe.webhookSecret
	});
	const request = new Request('http://localhost/api/payments/webhook', {
		method: 'POST',
		headers: { 'stripe-signature': header, 'content-type': 'application/json' },
		body: payload
	});
	return await POST({ request } as Parameters<typeof POST>[0]);
}

/** The completed event the provider sends for a session, from the session as it stands. */
async function completedEvent(sessionId: string, eventId = `evt_${tag}_${sessionId}`) {
	const session = await stripe().checkout.sessions.retrieve(sessionId);
	return {
		id: eventId,
		object: 'event',
		type: 'checkout.session.completed',
		created: Math.floor(Date.now() / 1000),
		data: { object: session }
	};
}

/** Pays a session on the stand-in's hosted page with a test card. */
async function payOnPage(sessionId: string) {
	const res = await fetch(`http://127.0.0.1:${config.stripe.port}/pay/${sessionId}`, {
		method: 'POST',
		redirect: 'manual',
		headers: { 'content-type': 'application/x-www-form-urlencoded' },
		body: new URLSearchParams({
			number: '4242424242424242', // the provider's documented test card
			expiry: '12/40',
			cvc: '123',
			name: 'Race Buyer'
		}).toString()
	});
	expect(res.status).toBe(303);
}

async function mailsTo(email: string) {
	const list = (await (
		await fetch(`${inbox}/api/messages?to=${encodeURIComponent(email)}`)
	).json()) as { subject: string }[];
	return list;
}

async function place(n: string | number) {
	return placeOrder(await newCart(), buyer(n), null, 'http://localhost');
}

beforeAll(async () => {
	woodId = await testWood(`${tag}-wood`, {
		name: 'Race walnut',
		botanicalName: 'Juglans nigra',
		specificGravityMilli: 550,
		densityKgM3: 610,
		sideHardnessN: 4490,
		toneLight: '#8a6a4f',
		toneDark: '#4a3426'
	});
	pieceId = await testPiece(`${tag}-piece`, [woodId], {
		title: 'Race trinket box',
		kind: 'box',
		personalisable: false,
		lengthMm: 100,
		widthMm: 70,
		thicknessMm: 40,
		basePriceMinor: 3800,
		pattern: { diameterMm: 40, count: 1 }
	});
	await testStock(pieceId, woodId, 1);
});

afterAll(async () => {
	await db
		.delete(s.orders)
		.where(
			inArray(
				s.orders.email,
				Array.from({ length: 40 }, (_, i) => buyer(i).email).concat(
					['a', 'b', 'basket'].map((n) => buyer(n).email)
				)
			)
		);
});

describe('a payment that lands after its hold was released', () => {
	it('never sells the last piece twice: one paid, one "piece gone" refunded, stock never below 0', async () => {
		await setShelf(1);
		// 1. Buyer A checks out the last box; it is held for them.
		const a = await place('a');
		expect(await shelf()).toBe(0);
		const aSession = (await orderRow(a.ref)).checkoutSessionId!;
		// 2. A's hold runs out (the sweep runs 40 minutes later) while A is still on the payment page.
		expect(await releaseExpiredHolds(new Date(Date.now() + 40 * 60_000))).toBeGreaterThanOrEqual(1);
		expect((await orderRow(a.ref)).status).toBe('cancelled');
		expect(await shelf()).toBe(1);
		// 3. Buyer B checks out the same box, pays, and the payment event lands.
		const b = await place('b');
		expect(await shelf()).toBe(0);
		const bSession = (await orderRow(b.ref)).checkoutSessionId!;
		await payOnPage(bSession);
		expect((await deliver(await completedEvent(bSession))).status).toBe(200);
		expect((await orderRow(b.ref)).status).toBe('paid');
		// 4. A pays after all (the provider's page was still open), and A's event arrives late.
		await payOnPage(aSession);
		const res = await deliver(await completedEvent(aSession));
		expect(res.status).toBe(200);
		expect(await res.json()).toMatchObject({ outcome: 'piece_gone' });

		const rowA = await orderRow(a.ref);
		expect(rowA.status).toBe('piece_gone');
		expect(rowA.refundedMinor).toBe(rowA.totalMinor);
		expect((await orderRow(b.ref)).status).toBe('paid');
		expect(await shelf()).toBe(0);
		// The refund exists at the payment provider for A's payment.
		// The provider holds the full refund: asking for another is refused as already refunded.
		await expect(
			stripe().refunds.create({ payment_intent: rowA.paymentIntentId! })
		).rejects.toMatchObject({ code: 'charge_already_refunded' });
		// A is told plainly; B gets the usual confirmation.
		const aMail = await mailsTo(buyer('a').email);
		expect(aMail.some((m) => /sold before your payment/.test(m.subject))).toBe(true);
		expect((await mailsTo(buyer('b').email)).filter((m) => /is paid/.test(m.subject))).toHaveLength(
			1
		);
		// The history says who moved it (the payment server: no user) and why.
		const history = await orderHistoryOf(rowA.id);
		expect(history.map((h) => h.toStatus)).toEqual(['cancelled', 'piece_gone']);
		expect(history.every((h) => h.userId === null && h.reason.length > 0)).toBe(true);
	});

	it('takes the piece again when it is still on the shelf', async () => {
		await setShelf(1);
		const a = await place(30);
		const session = (await orderRow(a.ref)).checkoutSessionId!;
		await releaseExpiredHolds(new Date(Date.now() + 40 * 60_000));
		expect(await shelf()).toBe(1);
		await payOnPage(session);
		expect((await deliver(await completedEvent(session))).status).toBe(200);
		expect((await orderRow(a.ref)).status).toBe('paid');
		expect(await shelf()).toBe(0);
	});
});

describe('payment events at once', () => {
	it('20 different events for 20 orders delivered together: all 200, each paid once, one e-mail each', async () => {
		await setShelf(20);
		const orders = [];
		for (let i = 0; i < 20; i++) orders.push(await place(i));
		expect(await shelf()).toBe(0);
		const events = [];
		for (const o of orders) {
			const sessionId = (await orderRow(o.ref)).checkoutSessionId!;
			await payOnPage(sessionId);
			events.push(await completedEvent(sessionId));
		}
		const answers = await Promise.all(events.map((e) => deliver(e)));
		expect(answers.map((r) => r.status)).toEqual(Array(20).fill(200));
		for (let i = 0; i < 20; i++) {
			const row = await orderRow(orders[i].ref);
			expect(row.status).toBe('paid');
			expect((await orderHistoryOf(row.id)).filter((h) => h.toStatus === 'paid')).toHaveLength(1);
			expect((await mailsTo(buyer(i).email)).filter((m) => /is paid/.test(m.subject))).toHaveLength(
				1
			);
		}
		expect(await shelf()).toBe(0);
	});

	it('the same event 20 times together: one change', async () => {
		await setShelf(1);
		const o = await place(25);
		const sessionId = (await orderRow(o.ref)).checkoutSessionId!;
		await payOnPage(sessionId);
		const event = await completedEvent(sessionId);
		const answers = await Promise.all(Array.from({ length: 20 }, () => deliver(event)));
		expect(answers.map((r) => r.status)).toEqual(Array(20).fill(200));
		const bodies = (await Promise.all(answers.map((r) => r.json()))) as { changed: boolean }[];
		expect(bodies.filter((b) => b.changed)).toHaveLength(1);
		const row = await orderRow(o.ref);
		expect((await orderHistoryOf(row.id)).filter((h) => h.toStatus === 'paid')).toHaveLength(1);
		expect(
			await db.select().from(s.processedEvents).where(eq(s.processedEvents.id, event.id))
		).toHaveLength(1);
		expect((await mailsTo(buyer(25).email)).filter((m) => /is paid/.test(m.subject))).toHaveLength(
			1
		);
	});

	it('a signed event with missing fields is a 400 with a reason, not a 500', async () => {
		const res = await deliver({
			id: `evt_${tag}_empty`,
			object: 'event',
			type: 'checkout.session.completed',
			data: {}
		});
		expect(res.status).toBe(400);
		const body = (await res.json()) as { error: string };
		expect(body.error).toMatch(/data\.object/);
		expect(
			await db
				.select()
				.from(s.processedEvents)
				.where(eq(s.processedEvents.id, `evt_${tag}_empty`))
		).toHaveLength(0);
	});
});

describe('one basket', () => {
	it('sent to checkout 10 times at once: one pending order, one hold', async () => {
		await setShelf(3);
		const cart = await newCart();
		const results = await Promise.allSettled(
			Array.from({ length: 10 }, () => createPendingOrder(cart, buyer('basket'), null))
		);
		expect(results.filter((r) => r.status === 'fulfilled').length).toBeGreaterThanOrEqual(1);
		const pending = await db
			.select()
			.from(s.orders)
			.where(and(eq(s.orders.cartId, cart), eq(s.orders.status, 'pending')));
		expect(pending).toHaveLength(1);
		expect(await shelf()).toBe(2); // one box held, two still for sale
	});
});

describe('status moves', () => {
	it('refuses every move the table does not allow, with a plain 409 message, and changes nothing', async () => {
		await setShelf(1);
		const o = await place(35);
		const row = await orderRow(o.ref);
		let refused = 0;
		for (const from of orderStatuses) {
			await db.update(s.orders).set({ status: from }).where(eq(s.orders.id, row.id));
			// This order's only line is a finished box: a ready-made order.
			const allowed = nextStatuses(from, { needsCarving: false });
			for (const to of orderStatuses.filter((t) => !allowed.includes(t))) {
				const err = await moveOrder(row.id, to, { userId: null, why: 'test' }).catch(
					(e: unknown) => e
				);
				expect(err, `${from} → ${to}`).toBeInstanceOf(DomainError);
				expect((err as DomainError).status).toBe(409);
				expect((err as Error).message).toMatch(/cannot move/);
				expect((await orderRow(o.ref)).status).toBe(from);
				refused++;
			}
		}
		expect(refused).toBeGreaterThan(50);
		// And an allowed one goes through and is written down.
		await db.update(s.orders).set({ status: 'paid' }).where(eq(s.orders.id, row.id));
		await moveOrder(row.id, 'packed', { userId: null, why: 'Packed at the bench' });
		expect((await orderRow(o.ref)).status).toBe('packed');
		expect((await orderHistoryOf(row.id)).at(-1)).toMatchObject({
			fromStatus: 'paid',
			toStatus: 'packed',
			reason: 'Packed at the bench'
		});
	});
});
