/**
 * Shipping and refunds against the real MariaDB and the running payment and mail stand-ins that
 * `npm test` starts: the order moves only along the status table, nothing is half-written on a
 * refusal, concurrent requests cannot ship twice or refund more than was paid, and the buyer's
 * e-mails (parsed from the raw message with `mailparser`, a general-purpose reference parser)
 * carry the tracking number and the refunded amount.
 */
import { eq } from 'drizzle-orm';
import { simpleParser } from 'mailparser';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import { paidIntent, testLine, testOrder } from '../helpers/fixtures';
import { config } from '$lib/server/config';
import { shipOrder } from '$lib/server/orders/ship';
import {
	handleRefundEvent,
	refundedChargeObject,
	refundObject,
	refundOrder
} from '$lib/server/orders/refunds';
import { shipmentSchema } from '$lib/orders/shipment-schema';
import { orderLink } from '$lib/server/orders/links';
import { DomainError } from '$lib/server/errors/domain-error';

const tag = `wo${process.pid}${Date.now() % 100000}`;
const inbox = `http://127.0.0.1:${config.mail.inboxPort}/api/messages`;
let owner = '';
let pieceId = 0;
let woodId = 0;
let n = 0;

async function newOrder(status: s.OrderStatus, totalMinor = 10250, paid = true) {
	const ref = `${tag}-${++n}`.slice(0, 16);
	const email = `buyer-${ref.toLowerCase()}@example.test`;
	const id = await testOrder(
		{
			ref,
			email,
			buyerName: 'Odile Varga',
			address: { line1: '4 Reed Row', city: 'Linden Ford', postcode: '05001', country: 'US' },
			totalMinor,
			status,
			paymentIntentId: paid ? await paidIntent(totalMinor) : null,
			paidAt: paid ? new Date() : null
		},
		[testLine(pieceId, woodId, totalMinor)]
	);
	return { id, ref, email };
}

async function order(id: number) {
	const [o] = await db.select().from(s.orders).where(eq(s.orders.id, id));
	return o;
}

async function mailTo(email: string, subject: RegExp) {
	for (let i = 0; i < 100; i++) {
		const list = (await (await fetch(`${inbox}?to=${encodeURIComponent(email)}`)).json()) as {
			id: string;
			subject: string;
		}[];
		const m = list.find((x) => subject.test(x.subject));
		if (m)
			return simpleParser(Buffer.from(await (await fetch(`${inbox}/${m.id}/raw`)).arrayBuffer()));
		await new Promise((r) => setTimeout(r, 50));
	}
	throw new Error(`no mail to ${email} matching ${subject}`);
}

beforeAll(async () => {
	const [u] = await db.select().from(s.users).where(eq(s.users.role, 'owner')).limit(1);
	owner = u.id;
	const [p] = await db.select({ id: s.pieces.id }).from(s.pieces).limit(1);
	const [w] = await db.select({ id: s.woods.id }).from(s.woods).limit(1);
	pieceId = p.id;
	woodId = w.id;
});

afterAll(async () => {
	await db.delete(s.orders).where(eq(s.orders.buyerName, 'Odile Varga'));
});

describe('shipping an order', () => {
	it('refuses control characters in a tracking number and tidies spaces', () => {
		expect(
			shipmentSchema.safeParse({ carrier: 'USPS', trackingNumber: '9400\u0007111' }).success
		).toBe(false);
		expect(
			shipmentSchema.safeParse({ carrier: 'USPS', trackingNumber: '9400 1118\n99' }).success
		).toBe(false);
		expect(shipmentSchema.parse({ carrier: ' UPS ', trackingNumber: '1z 999-aa1' })).toEqual({
			carrier: 'UPS',
			trackingNumber: '1Z999AA1'
		});
	});

	it('refuses an unpaid or unpacked order with a reason, writing nothing', async () => {
		for (const status of ['pending', 'paid'] as const) {
			const o = await newOrder(status, 5000, status !== 'pending');
			await expect(
				shipOrder(o.ref, { carrier: 'USPS', trackingNumber: '9400111899223344' }, { userId: owner })
			).rejects.toBeInstanceOf(DomainError);
			expect((await order(o.id)).status).toBe(status);
			expect(await db.select().from(s.shipments).where(eq(s.shipments.orderId, o.id))).toEqual([]);
		}
	});

	it('ships a packed order once under two concurrent requests, with history and e-mail', async () => {
		const o = await newOrder('packed');
		const tracking = '9400111899223344556677';
		const results = await Promise.allSettled([
			shipOrder(o.ref, { carrier: 'USPS', trackingNumber: tracking }, { userId: owner }),
			shipOrder(o.ref, { carrier: 'USPS', trackingNumber: tracking }, { userId: owner })
		]);
		expect(results.filter((r) => r.status === 'fulfilled')).toHaveLength(1);
		const refused = results.find((r) => r.status === 'rejected') as PromiseRejectedResult;
		expect(refused.reason).toBeInstanceOf(DomainError);
		expect((await order(o.id)).status).toBe('shipped');
		expect(await db.select().from(s.shipments).where(eq(s.shipments.orderId, o.id))).toHaveLength(
			1
		);
		const history = await db.select().from(s.orderHistory).where(eq(s.orderHistory.orderId, o.id));
		expect(history.map((h) => [h.fromStatus, h.toStatus, h.userId])).toEqual([
			['packed', 'shipped', owner]
		]);

		const mail = await mailTo(o.email, /on its way/);
		expect(mail.text).toContain(tracking);
		expect(mail.html).toContain(tracking);
		// USPS publishes its tracking page at tools.usps.com/go/TrackConfirmAction?tLabels=…
		expect(mail.text).toContain(`TrackConfirmAction?tLabels=${tracking}`);
		expect(mail.text).toContain(orderLink(o.ref));
	});
});

describe('refunds', () => {
	it('refuses an unpaid order and more than was paid, sending nothing', async () => {
		const unpaid = await newOrder('pending', 5000, false);
		await expect(
			refundOrder(
				unpaid.ref,
				{ amountMinor: 100, reason: 'test', restock: false },
				{ userId: owner }
			)
		).rejects.toThrow(/not been paid/);
		const o = await newOrder('paid', 5000);
		const over = refundOrder(
			o.ref,
			{ amountMinor: 5001, reason: 'too much', restock: false },
			{ userId: owner }
		);
		await expect(over).rejects.toBeInstanceOf(DomainError);
		await expect(over).rejects.toThrow(/at most \$50\.00/);
		expect(await db.select().from(s.orderRefunds).where(eq(s.orderRefunds.orderId, o.id))).toEqual(
			[]
		);
	});

	it('partial then full; concurrent refunds never pass what was paid', async () => {
		const o = await newOrder('shipped', 10250);
		const part = await refundOrder(
			o.ref,
			{ amountMinor: 3000, reason: 'A chip broke out at the rim', restock: false },
			{ userId: owner }
		);
		// 10,250 − 3,000 = 7,250 left (worked by hand).
		expect(part).toMatchObject({ amountMinor: 3000, refundedMinor: 3000 });
		expect((await order(o.id)).status).toBe('shipped');
		const partMail = await mailTo(o.email, /Refund of \$30\.00/);
		expect(partMail.text).toContain('$30.00');

		// Two refunds of 4,000 at once: only one fits in the 7,250 left.
		const both = await Promise.allSettled([
			refundOrder(o.ref, { amountMinor: 4000, reason: 'one', restock: false }, { userId: owner }),
			refundOrder(o.ref, { amountMinor: 4000, reason: 'two', restock: false }, { userId: owner })
		]);
		expect(both.filter((r) => r.status === 'fulfilled')).toHaveLength(1);
		expect((await order(o.id)).refundedMinor).toBe(7000);

		const rest = await refundOrder(
			o.ref,
			{ amountMinor: null, reason: 'Returned unused', restock: true },
			{ userId: owner }
		);
		expect(rest).toMatchObject({ amountMinor: 3250, refundedMinor: 10250 });
		const after = await order(o.id);
		expect(after.status).toBe('refunded');
		const rows = await db.select().from(s.orderRefunds).where(eq(s.orderRefunds.orderId, o.id));
		expect(rows.map((r) => r.status)).toEqual(['succeeded', 'succeeded', 'succeeded']);
		expect(rows.filter((r) => r.restocked)).toHaveLength(1);
	});

	it('applies charge.refunded and refund.updated events once, however often they come', async () => {
		const o = await newOrder('paid', 8000);
		const pi = (await order(o.id)).paymentIntentId!;
		const charge = { payment_intent: pi, amount_refunded: 8000, metadata: {} };
		const refund = {
			id: `re_${tag}`,
			object: 'refund',
			amount: 8000,
			payment_intent: pi,
			status: 'succeeded',
			reason: null,
			metadata: {},
			created: Math.floor(Date.now() / 1000)
		};
		for (let i = 0; i < 2; i++) {
			await db.transaction((tx) =>
				handleRefundEvent({ type: 'refund.updated', object: refundObject.parse(refund) }, tx)
			);
			await db.transaction((tx) =>
				handleRefundEvent(
					{ type: 'charge.refunded', object: refundedChargeObject.parse(charge) },
					tx
				)
			);
		}
		const after = await order(o.id);
		expect(after).toMatchObject({ refundedMinor: 8000, status: 'refunded' });
		expect(
			await db.select().from(s.orderRefunds).where(eq(s.orderRefunds.orderId, o.id))
		).toHaveLength(1);
	});
});
