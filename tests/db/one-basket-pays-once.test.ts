/**
 * One basket is charged once, against the real MariaDB and the payment stand-in (which speaks the
 * provider's API through the official SDK): the same basket sent to checkout 10 times at once
 * (double taps, two tabs, the back button), and every payment page that came back paid. A page
 * that a newer checkout replaced but the buyer paid anyway is refunded in full, with one letter.
 * Refund events are held to what the shop knows. "Charge a buyer once per purchase" and "never
 * refund more than was paid" are common practice; the provider's own API refuses a refund
 * beyond the charge (its documented `amount` rule for refunds), which the stand-in follows.
 */
import Stripe from 'stripe';
import { eq, inArray } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import { shelfCount, testCart, testPiece, testStock, testWood } from '../helpers/fixtures';
import { config } from '$lib/server/config';
import { createPendingOrder, placeOrder } from '$lib/server/orders/place';
import { stripe } from '$lib/server/orders/stripe';
import type { CheckoutInput } from '$lib/cart/checkout-schema';
import { POST } from '../../src/routes/api/payments/webhook/+server';

const tag = `ob${process.pid}${Date.now() % 100000}`;
const sdk = new Stripe('sk_test_unused');
const inbox = `http://127.0.0.1:${config.mail.inboxPort}`;
let pieceId = 0;
let woodId = 0;
const emails: string[] = [];

const buyer = (n: string | number): CheckoutInput => {
	const email = `basket-${tag}-${n}@example.test`.toLowerCase();
	emails.push(email);
	return {
		name: `Basket Buyer ${n}`,
		email,
		line1: '1 Test Lane',
		city: 'Testville',
		region: 'VT',
		postcode: '05002',
		country: 'US'
	};
};

const newCart = () => testCart(tag);
const shelf = () => shelfCount(pieceId, woodId);

const ordersOf = (cartId: string) => db.select().from(s.orders).where(eq(s.orders.cartId, cartId));

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

const event = (type: string, object: object, id = `evt_${tag}_${crypto.randomUUID()}`) => ({
	id,
	object: 'event',
	type,
	created: Math.floor(Date.now() / 1000),
	data: { object }
});

/** Pays on the stand-in's page with the provider's documented test card; true when it took. */
async function payOnPage(url: string) {
	const res = await fetch(url, {
		method: 'POST',
		redirect: 'manual',
		headers: { 'content-type': 'application/x-www-form-urlencoded' },
		body: new URLSearchParams({
			number: '4242424242424242',
			expiry: '12/40',
			cvc: '123',
			name: 'Basket Buyer'
		}).toString()
	});
	return res.status === 303;
}

const sessionOf = (url: string) => url.split('/').pop()!;

async function mailsTo(email: string) {
	return (await (await fetch(`${inbox}/api/messages?to=${encodeURIComponent(email)}`)).json()) as {
		subject: string;
		text?: string;
	}[];
}

beforeAll(async () => {
	woodId = await testWood(`${tag}-wood`, {
		name: 'Basket cherry',
		botanicalName: 'Prunus serotina',
		specificGravityMilli: 500,
		densityKgM3: 560,
		sideHardnessN: 4230,
		toneLight: '#b07a57',
		toneDark: '#6e4630'
	});
	pieceId = await testPiece(`${tag}-piece`, [woodId], {
		title: 'Basket trinket box',
		kind: 'box',
		personalisable: false,
		lengthMm: 100,
		widthMm: 70,
		thicknessMm: 40,
		basePriceMinor: 3800,
		pattern: { diameterMm: 40, count: 1 }
	});
	await testStock(pieceId, woodId, 20);
});

afterAll(async () => {
	await db.delete(s.orders).where(inArray(s.orders.email, emails));
});

describe('one basket, one charge', () => {
	it('10 checkouts at once, every page that came back paid: one order charged and kept, stock taken once', async () => {
		const before = await shelf();
		const cart = await newCart();
		const who = buyer('ten');
		const results = await Promise.allSettled(
			Array.from({ length: 10 }, () => placeOrder(cart, who, null, 'http://localhost'))
		);
		const pages = results.flatMap((r) => (r.status === 'fulfilled' ? [r.value.paymentUrl] : []));
		expect(pages.length).toBeGreaterThanOrEqual(1);
		// The buyer pays on every page they were given (two tabs, a back button...).
		for (const url of pages) await payOnPage(url);
		// Whatever the provider completed, its event reaches the shop (each twice, as retries do).
		for (const url of pages) {
			const session = await stripe().checkout.sessions.retrieve(sessionOf(url));
			if (session.status !== 'complete') continue;
			const e = event('checkout.session.completed', session);
			expect((await deliver(e)).status).toBe(200);
			expect((await deliver(e)).status).toBe(200);
		}

		const rows = await ordersOf(cart);
		const charged = rows.filter((o) => o.paymentIntentId);
		const kept = charged.filter((o) => o.refundedMinor < o.totalMinor);
		expect(kept).toHaveLength(1);
		expect(kept[0].status).toBe('paid');
		// Any other charge went back in full.
		for (const o of charged.filter((c) => c !== kept[0]))
			expect(o.refundedMinor).toBe(o.totalMinor);
		// At the provider: exactly one completed session of these is not refunded.
		let unrefunded = 0;
		for (const url of pages) {
			const session = await stripe().checkout.sessions.retrieve(sessionOf(url), {
				expand: ['payment_intent']
			});
			if (session.status !== 'complete') continue;
			const refunds = await stripe().refunds.list({
				payment_intent: (session.payment_intent as Stripe.PaymentIntent).id
			});
			if (refunds.data.length === 0) unrefunded++;
		}
		expect(unrefunded).toBe(1);
		expect(await shelf()).toBe(before - 1);
		expect((await mailsTo(who.email)).filter((m) => /is paid/.test(m.subject))).toHaveLength(1);
	}, 120_000);

	it('a replaced page paid anyway is refunded in full, the buyer told once, the stock untouched', async () => {
		const before = await shelf();
		const cart = await newCart();
		const who = buyer('tabs');
		const first = await placeOrder(cart, who, null, 'http://localhost');
		expect(await shelf()).toBe(before - 1);
		// A second checkout of the basket replaces the first order (its page not yet closed:
		// the buyer was quicker, paying in the first tab at that very moment).
		await createPendingOrder(cart, who, null);
		expect(await payOnPage(first.paymentUrl)).toBe(true);
		const session = await stripe().checkout.sessions.retrieve(sessionOf(first.paymentUrl));
		const res = await deliver(event('checkout.session.completed', session));
		expect(res.status).toBe(200);
		expect(await res.json()).toMatchObject({ outcome: 'replaced' });

		const [old] = await db.select().from(s.orders).where(eq(s.orders.ref, first.ref));
		expect(old.status).toBe('cancelled');
		expect(old.refundedMinor).toBe(old.totalMinor);
		const refunds = await stripe().refunds.list({ payment_intent: old.paymentIntentId! });
		expect(refunds.data.map((r) => r.amount)).toEqual([old.totalMinor]);
		// The newer order holds the one box; the replaced one gave its box back.
		expect(await shelf()).toBe(before - 1);
		const letters = (await mailsTo(who.email)).filter((m) => m.subject.includes(first.ref));
		expect(letters).toHaveLength(1);
		expect(letters[0].subject).toMatch(/second payment for one basket, refunded/);
	}, 60_000);
});

describe('refund events held to what the shop knows', () => {
	async function paidOrder(n: string) {
		const cart = await newCart();
		const placed = await placeOrder(cart, buyer(n), null, 'http://localhost');
		await payOnPage(placed.paymentUrl);
		const session = await stripe().checkout.sessions.retrieve(sessionOf(placed.paymentUrl));
		expect((await deliver(event('checkout.session.completed', session))).status).toBe(200);
		const [row] = await db.select().from(s.orders).where(eq(s.orders.ref, placed.ref));
		expect(row.status).toBe('paid');
		return row;
	}
	const notes = (orderId: number) =>
		db.select().from(s.orderNotes).where(eq(s.orderNotes.orderId, orderId));

	it('charge.refunded for ten times the total: 200, nothing changes, a note for the owner', async () => {
		const o = await paidOrder('tenfold');
		const res = await deliver(
			event('charge.refunded', {
				object: 'charge',
				payment_intent: o.paymentIntentId,
				amount_refunded: o.totalMinor * 10,
				metadata: { orderRef: o.ref }
			})
		);
		expect(res.status).toBe(200);
		expect(await res.json()).toMatchObject({ changed: false });
		const [after] = await db.select().from(s.orders).where(eq(s.orders.id, o.id));
		expect(after).toMatchObject({ refundedMinor: 0, status: 'paid' });
		expect((await notes(o.id)).map((n) => n.body).join(' ')).toMatch(/more than the .* paid/);
	}, 60_000);

	it('refund.updated with one order’s payment naming another order: 200, no refund row anywhere', async () => {
		const a = await paidOrder('owner-a');
		const b = await paidOrder('owner-b');
		const res = await deliver(
			event('refund.updated', {
				id: `re_${tag}_cross`,
				object: 'refund',
				amount: 100,
				payment_intent: a.paymentIntentId,
				status: 'succeeded',
				created: Math.floor(Date.now() / 1000),
				metadata: { orderRef: b.ref }
			})
		);
		expect(res.status).toBe(200);
		expect(await res.json()).toMatchObject({ changed: false });
		for (const o of [a, b]) {
			expect(
				await db.select().from(s.orderRefunds).where(eq(s.orderRefunds.orderId, o.id))
			).toHaveLength(0);
			const [after] = await db.select().from(s.orders).where(eq(s.orders.id, o.id));
			expect(after.refundedMinor).toBe(0);
		}
		expect((await notes(b.id)).map((n) => n.body).join(' ')).toMatch(/not the payment of order/);
	}, 60_000);

	it('refund.updated past what was paid is refused; one within it is kept', async () => {
		const o = await paidOrder('capped');
		const over = await deliver(
			event('refund.updated', {
				id: `re_${tag}_over`,
				object: 'refund',
				amount: o.totalMinor + 1,
				payment_intent: o.paymentIntentId,
				status: 'succeeded',
				created: Math.floor(Date.now() / 1000),
				metadata: {}
			})
		);
		expect(await over.json()).toMatchObject({ changed: false });
		const within = await deliver(
			event('refund.updated', {
				id: `re_${tag}_within`,
				object: 'refund',
				amount: 500,
				payment_intent: o.paymentIntentId,
				status: 'succeeded',
				created: Math.floor(Date.now() / 1000),
				metadata: {}
			})
		);
		expect(await within.json()).toMatchObject({ changed: true });
		const [after] = await db.select().from(s.orders).where(eq(s.orders.id, o.id));
		expect(after.refundedMinor).toBe(500);
	}, 60_000);
});
