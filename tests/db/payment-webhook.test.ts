/**
 * The payment webhook route against the real database: signatures checked with the official
 * `stripe` SDK (the reference for Stripe's scheme: header `t=…,v1=…`, HMAC-SHA256 over
 * `t.payload`, 300 s tolerance — Stripe docs "Check the webhook signatures"), bad or old
 * signatures answered 400, and a repeated event applied once.
 */
import { and, eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import { config } from '$lib/server/config';
import { POST } from '../../src/routes/api/payments/webhook/+server';
import { completedEvent, insertPendingOrder, signEvent } from '../helpers/payment-fixture';

const secret = config.stripe.webhookSecret;
const tag = `w${process.pid}${Date.now() % 100000}`;
let orderId = 0;
let ref = '';

const sign = (payload: string, opts: { secret?: string; timestamp?: number } = {}) =>
	signEvent(payload, opts.secret ?? secret, opts.timestamp);

function call(payload: string, header: string | null) {
	const request = new Request('http://localhost/api/payments/webhook', {
		method: 'POST',
		headers: header ? { 'stripe-signature': header, 'content-type': 'application/json' } : {},
		body: payload
	});
	// The route only reads the request.
	return POST({ request } as Parameters<typeof POST>[0]) as Promise<Response>;
}

const completed = (eventId: string) => completedEvent(eventId, ref, tag);

beforeAll(async () => {
	ref = `CS-${tag.slice(-6).toUpperCase().padStart(6, 'W')}`;
	orderId = await insertPendingOrder(db, ref, tag, 'webhook-test@example.test');
});

const status = async () =>
	(await db.select().from(s.orders).where(eq(s.orders.id, orderId)))[0].status;

describe('POST /api/payments/webhook', () => {
	it('answers 400 to a missing, wrong-secret, tampered or old signature and changes nothing', async () => {
		const body = completed(`evt_${tag}_bad`);
		expect((await call(body, null)).status).toBe(400);
		expect((await call(body, sign(body, { secret: 'whsec_someone_else' }))).status).toBe(400);
		const tampered = body.replace('"paid"', '"unpaid"');
		expect((await call(tampered, sign(body))).status).toBe(400);
		// Older than the SDK's default 300 s tolerance.
		const old = sign(body, { timestamp: Math.floor(Date.now() / 1000) - 600 });
		const res = await call(body, old);
		expect(res.status).toBe(400);
		// eslint-disable-next-line @typescript-eslint/no-unsafe-assignment -- vitest types asymmetric matchers as any
		expect(await res.json()).toMatchObject({ error: expect.any(String) });
		expect(await status()).toBe('pending');
	});

	it('refuses a signature timestamped beyond the tolerance in either direction, with a reason', async () => {
		const body = completed(`evt_${tag}_skew`);
		const now = Math.floor(Date.now() / 1000);
		// 300 s either way: the SDK's default tolerance (Stripe docs "Check the webhook signatures");
		// the SDK itself only refuses the old side, so the future side is ours.
		for (const timestamp of [now + 3600, now + 301, now - 301]) {
			const res = await call(body, sign(body, { timestamp }));
			expect(res.status, String(timestamp - now)).toBe(400);
			const { error } = (await res.json()) as { error: string };
			expect(error).toMatch(timestamp > now ? /future/ : /tolerance/i);
		}
		expect(await status()).toBe('pending');
		// Just inside the window is fine (nothing to do yet: a different event id, same order).
		const near = await call(
			completed(`evt_${tag}_near`),
			sign(completed(`evt_${tag}_near`), { timestamp: now + 60 })
		);
		expect(near.status).toBe(200);
		await db
			.update(s.orders)
			.set({ status: 'pending', paidAt: null })
			.where(eq(s.orders.id, orderId));
		await db.delete(s.orderHistory).where(eq(s.orderHistory.orderId, orderId));
	});

	it('applies a signed checkout.session.completed once, however often it arrives', async () => {
		const body = completed(`evt_${tag}_ok`);
		const first = await call(body, sign(body));
		expect(first.status).toBe(200);
		expect(await first.json()).toMatchObject({ received: true, changed: true });
		expect(await status()).toBe('paid');

		const again = await call(body, sign(body));
		expect(again.status).toBe(200);
		expect(await again.json()).toMatchObject({ received: true, changed: false });
		const events = await db
			.select()
			.from(s.processedEvents)
			.where(
				and(
					eq(s.processedEvents.id, `evt_${tag}_ok`),
					eq(s.processedEvents.type, 'checkout.session.completed')
				)
			);
		expect(events).toHaveLength(1);
	});

	it('accepts and ignores event types it does not handle', async () => {
		const body = JSON.stringify({
			id: `evt_${tag}_other`,
			object: 'event',
			type: 'charge.updated',
			data: { object: {} }
		});
		const res = await call(body, sign(body));
		expect(res.status).toBe(200);
		expect(await res.json()).toMatchObject({ handled: false });
	});
});
