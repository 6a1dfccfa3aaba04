/**
 * A pending order straight in the database, and a signed checkout.session.completed event for
 * it, signed with the official `stripe` SDK's test-header generator (the reference for the
 * provider's signature scheme). Shared by the webhook, outbox and several-process tests.
 */
import Stripe from 'stripe';
import { eq } from 'drizzle-orm';
import type { MySql2Database } from 'drizzle-orm/mysql2';
import * as s from '../../src/lib/server/db/schema';

const sdk = new Stripe('sk_test_unused');

type AnyDb = MySql2Database<typeof s>;

export function signEvent(payload: string, secret: string, timestamp?: number) {
	return sdk.webhooks.generateTestHeaderString({ payload, secret, timestamp });
}

export function completedEvent(eventId: string, ref: string, tag: string) {
	return JSON.stringify({
		id: eventId,
		object: 'event',
		type: 'checkout.session.completed',
		created: Math.floor(Date.now() / 1000),
		data: {
			object: {
				id: `cs_${tag}`,
				object: 'checkout.session',
				payment_status: 'paid',
				status: 'complete',
				payment_intent: `pi_${tag}`,
				client_reference_id: ref,
				metadata: { orderRef: ref }
			}
		}
	});
}

/** Inserts a pending one-line order whose checkout session is `cs_<tag>`; returns its id. */
export async function insertPendingOrder(db: AnyDb, ref: string, tag: string, email: string) {
	const [piece] = await db.select().from(s.pieces).limit(1);
	const [wood] = await db.select().from(s.woods).limit(1);
	const [{ id }] = await db
		.insert(s.orders)
		.values({
			ref,
			email,
			buyerName: 'Webhook Test',
			address: { line1: '1 Lane', city: 'Boulder', region: 'CO', postcode: '80302', country: 'US' },
			currency: 'USD',
			subtotalMinor: 4800,
			shippingMinor: 900,
			taxMinor: 0,
			totalMinor: 5700,
			status: 'pending',
			checkoutSessionId: `cs_${tag}`,
			createdAt: new Date()
		})
		.$returningId();
	await db.insert(s.orderLines).values({
		orderId: id,
		pieceId: piece.id,
		woodId: wood.id,
		title: piece.title,
		woodName: wood.name,
		quantity: 1,
		unitPriceMinor: 4800,
		lineTotalMinor: 4800,
		fromStock: false,
		personalisation: {
			initials: 'WT',
			style: 'classic',
			diameterMm: 60,
			count: 1,
			spacingMm: 30,
			split: false
		}
	});
	return id;
}

export async function orderStatus(db: AnyDb, id: number) {
	return (await db.select({ status: s.orders.status }).from(s.orders).where(eq(s.orders.id, id)))[0]
		.status;
}
