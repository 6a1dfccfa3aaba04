/**
 * The owner steering orders, against the real MariaDB and the running payment and mail
 * stand-ins: one step back and cancel each need a reason and write it to the history through
 * `moveOrder`; a paid order is refunded in full by the refund code when cancelled; two clicks at
 * once record one move. The table's views keep unpaid checkouts apart, search finds an order by
 * town and by the initials carved, and the CSV export applies the same filters.
 */
import { eq, like } from 'drizzle-orm';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import { stripe } from '$lib/server/orders/stripe';
import { cancelOrder, stepBackOrder } from '$lib/server/orders/steer';
import { orderHistoryOf } from '$lib/server/orders/status';
import { listWorkshopOrders } from '$lib/server/orders/table';
import { EXPORT_COLUMNS, ordersCsv } from '$lib/server/orders/export';
import { orderTableQuery } from '$lib/orders/workshop-orders-schema';
import { steerSchema } from '$lib/orders/actions-schema';
import { stepBackTo } from '$lib/orders/status';
import { csvText } from '$lib/orders/csv-safe';
import { majorText } from '$lib/locale/money';
import { mailTo, paidIntent, testLine, testOrder } from '../helpers/fixtures';
import { DomainError } from '$lib/server/errors/domain-error';

const tag = `st${process.pid % 1000}${Date.now() % 10000}`;
let owner = '';
let pieceId = 0;
let woodId = 0;
let n = 0;

type Opts = { paid?: boolean; city?: string; initials?: string; refunded?: number; name?: string };

async function newOrder(status: s.OrderStatus, o: Opts = {}) {
	const paid = o.paid ?? status !== 'pending';
	const ref = `${tag}-${++n}`.slice(0, 16);
	const total = 4200;
	const id = await testOrder(
		{
			ref,
			email: `steer-${ref.toLowerCase()}@example.test`,
			buyerName: o.name ?? `Steer ${tag}`,
			address: { line1: '2 Quay', city: o.city ?? 'Marrow', postcode: '05001', country: 'US' },
			totalMinor: total,
			refundedMinor: o.refunded ?? 0,
			status,
			paymentIntentId: paid && status !== 'cancelled' ? await paidIntent(total) : null,
			paidAt: paid ? new Date() : null
		},
		[
			testLine(pieceId, woodId, total, {
				title: 'Plate',
				woodName: 'Basswood',
				fromStock: !o.initials,
				personalisation: o.initials
					? {
							initials: o.initials,
							style: 'classic',
							diameterMm: 60,
							count: 1,
							spacingMm: 0,
							split: false,
							estimateMinutes: 40
						}
					: null
			})
		]
	);
	return { id, ref };
}

const statusOf = async (id: number) =>
	(await db.select({ s: s.orders.status }).from(s.orders).where(eq(s.orders.id, id)))[0].s;

beforeAll(async () => {
	[{ id: owner }] = await db
		.select({ id: s.users.id })
		.from(s.users)
		.where(eq(s.users.role, 'owner'))
		.limit(1);
	[{ id: pieceId }] = await db.select({ id: s.pieces.id }).from(s.pieces).limit(1);
	[{ id: woodId }] = await db.select({ id: s.woods.id }).from(s.woods).limit(1);
});

afterAll(async () => {
	await db.delete(s.orders).where(like(s.orders.ref, `${tag}-%`));
});

describe('one step back', () => {
	it('follows the flow backwards, carved and ready-made (DESIGN.md order status flow)', () => {
		const carved = { needsCarving: true };
		const ready = { needsCarving: false };
		expect(stepBackTo('carving', carved)).toBe('paid');
		expect(stepBackTo('finishing', carved)).toBe('carving');
		expect(stepBackTo('packed', carved)).toBe('finishing');
		// A ready-made order went paid → packed, so packed goes back to paid.
		expect(stepBackTo('packed', ready)).toBe('paid');
		for (const st of ['pending', 'paid', 'shipped', 'cancelled', 'refunded'] as const)
			expect(stepBackTo(st, carved), st).toBeNull();
	});

	it('writes the reason, who and the move to the history; a reason is required', async () => {
		const o = await newOrder('finishing', { initials: 'QV' });
		expect(steerSchema.safeParse({ reason: '  ', expect: 'finishing' }).success).toBe(false);
		await stepBackOrder(
			o.ref,
			{ reason: 'Oil went on blotchy', expect: 'finishing' },
			{ userId: owner }
		);
		expect(await statusOf(o.id)).toBe('carving');
		const h = (await orderHistoryOf(o.id)).at(-1)!;
		expect([h.fromStatus, h.toStatus, h.userId]).toEqual(['finishing', 'carving', owner]);
		expect(h.reason).toContain('Oil went on blotchy');
	});

	it('two clicks at once move the order back once', async () => {
		const o = await newOrder('packed', { initials: 'RT' });
		const go = () =>
			stepBackOrder(o.ref, { reason: 'Packed too soon', expect: 'packed' }, { userId: owner });
		const results = await Promise.allSettled([go(), go()]);
		expect(results.filter((r) => r.status === 'fulfilled')).toHaveLength(1);
		const refused = results.find((r) => r.status === 'rejected') as PromiseRejectedResult;
		expect(refused.reason).toBeInstanceOf(DomainError);
		expect(await statusOf(o.id)).toBe('finishing');
		expect((await orderHistoryOf(o.id)).filter((h) => h.fromStatus === 'packed')).toHaveLength(1);
	});

	it('a shipped order does not step back', async () => {
		const o = await newOrder('shipped');
		await expect(
			stepBackOrder(o.ref, { reason: 'Wrong parcel', expect: 'shipped' }, { userId: owner })
		).rejects.toBeInstanceOf(DomainError);
		expect(await statusOf(o.id)).toBe('shipped');
	});
});

describe('cancel', () => {
	it('an unpaid checkout is cancelled with the owner and reason in the history', async () => {
		const o = await newOrder('pending');
		const r = await cancelOrder(
			o.ref,
			{ reason: 'Buyer asked by phone', expect: 'pending' },
			{ userId: owner }
		);
		expect(r.refundedMinor).toBeNull();
		expect(await statusOf(o.id)).toBe('cancelled');
		const h = (await orderHistoryOf(o.id)).at(-1)!;
		expect([h.toStatus, h.userId]).toEqual(['cancelled', owner]);
		expect(h.reason).toContain('Buyer asked by phone');
	});

	it('a paid order is refunded in full at the payment server and the buyer told', async () => {
		const o = await newOrder('carving', { initials: 'MW' });
		const r = await cancelOrder(
			o.ref,
			{ reason: 'The blank cracked', expect: 'carving' },
			{ userId: owner },
			'http://localhost:5400'
		);
		expect(r.refundedMinor).toBe(4200);
		const [row] = await db.select().from(s.orders).where(eq(s.orders.id, o.id));
		expect([row.status, row.refundedMinor]).toEqual(['refunded', 4200]);
		// The stand-in holds the refund the SDK made, for the whole amount paid.
		const [mine] = await db.select().from(s.orderRefunds).where(eq(s.orderRefunds.orderId, o.id));
		const refund = await stripe().refunds.retrieve(mine.providerRefundId!);
		expect([refund.amount, refund.payment_intent]).toEqual([4200, row.paymentIntentId]);
		expect((await orderHistoryOf(o.id)).at(-1)!.reason).toContain('The blank cracked');
		const mail = await mailTo(row.email, /refund/i);
		expect(mail.text).toContain('The blank cracked');
	});

	it('two cancels at once refund once', async () => {
		const o = await newOrder('paid');
		const go = () =>
			cancelOrder(o.ref, { reason: 'Double click', expect: 'paid' }, { userId: owner });
		const results = await Promise.allSettled([go(), go()]);
		expect(results.filter((x) => x.status === 'fulfilled')).toHaveLength(1);
		const rows = await db.select().from(s.orderRefunds).where(eq(s.orderRefunds.orderId, o.id));
		expect(rows).toHaveLength(1);
		expect(rows[0].amountMinor).toBe(4200);
	});

	it('a shipped order is refunded, not cancelled', async () => {
		const o = await newOrder('shipped');
		await expect(
			cancelOrder(o.ref, { reason: 'Changed mind', expect: 'shipped' }, { userId: owner })
		).rejects.toThrow(/refund it instead/);
	});
});

describe('the table’s views, search and export', () => {
	const refsOf = async (over: Record<string, string>) =>
		(await listWorkshopOrders(orderTableQuery.parse({ q: tag, size: '100', ...over }))).rows
			.map((r) => r.ref)
			.sort();

	it('opens on what needs doing; unpaid checkouts only under their own view', async () => {
		const a = await newOrder('paid', { paid: false });
		await db.update(s.orders).set({ paidAt: new Date() }).where(eq(s.orders.id, a.id));
		const gone = await newOrder('piece_gone', { paid: false });
		const waiting = await newOrder('pending');
		const lapsed = await newOrder('cancelled', { paid: false });
		const shipped = await newOrder('shipped', { paid: false });
		const mine = (refs: string[]) =>
			refs.filter((r) => [a, gone, waiting, lapsed, shipped].some((o) => o.ref === r));
		expect(mine(await refsOf({}))).toEqual([a.ref, gone.ref].sort());
		expect(mine(await refsOf({ view: 'abandoned' }))).toEqual([waiting.ref, lapsed.ref].sort());
		expect(mine(await refsOf({ view: 'closed' }))).toEqual([shipped.ref]);
		const all = mine(await refsOf({ view: 'all' }));
		expect(all).not.toContain(waiting.ref);
		expect(all).not.toContain(lapsed.ref);
	});

	it('finds an order by the buyer’s town (any case, accents kept) and by the initials carved', async () => {
		const lodz = await newOrder('paid', { city: 'Łódź', paid: false });
		const carved = await newOrder('carving', { initials: 'ZQX', paid: false });
		const find = async (q: string) =>
			(await listWorkshopOrders(orderTableQuery.parse({ q, size: '100' }))).rows.map((r) => r.ref);
		expect(await find('łódź')).toContain(lodz.ref);
		expect(await find('zqx')).toEqual([carved.ref]);
		const row = (await listWorkshopOrders(orderTableQuery.parse({ q: lodz.ref }))).rows[0];
		expect(row.city).toBe('Łódź');
	});

	it('shows a part refund in the row', async () => {
		const part = await newOrder('carving', { refunded: 1250, paid: false });
		const row = (await listWorkshopOrders(orderTableQuery.parse({ q: part.ref }))).rows[0];
		expect([row.refundedMinor, row.totalMinor]).toEqual([1250, 4200]);
	});

	it('exports the filtered orders as CSV with a BOM, read back by papaparse', async () => {
		await newOrder('packed', { name: '=HYPERLINK("x")', city: 'São Paulo', paid: false });
		const csv = await ordersCsv(orderTableQuery.parse({ q: tag, status: 'packed' }));
		// Excel takes a CSV as UTF-8 only with the byte-order mark EF BB BF (U+FEFF) first.
		expect(Buffer.from(csv, 'utf8').subarray(0, 3)).toEqual(Buffer.from([0xef, 0xbb, 0xbf]));
		// RFC 4180 line ends; checked with papaparse (a general-purpose CSV parser).
		expect(csv).toContain('\r\n');
		const parsed = Papa.parse<Record<string, string>>(csv.slice(1), {
			header: true,
			skipEmptyLines: true
		});
		expect(parsed.errors).toEqual([]);
		expect(parsed.meta.fields).toEqual(EXPORT_COLUMNS);
		expect(parsed.data.length).toBeGreaterThan(0);
		expect(parsed.data.every((r) => r.status === 'Packed')).toBe(true);
		const sp = parsed.data.find((r) => r.town === 'São Paulo')!;
		expect(sp.total).toBe('42.00');
		// OWASP CSV injection: a formula a buyer typed is kept as text.
		expect(sp.buyer).toBe(`'=HYPERLINK("x")`);
	});

	it('writes amounts with the currency’s own digits (ISO 4217: USD 2, JPY 0, KWD 3)', () => {
		expect(majorText(4200, 'USD')).toBe('42.00');
		expect(majorText(5, 'USD')).toBe('0.05');
		expect(majorText(1500, 'JPY')).toBe('1500');
		expect(majorText(1234, 'KWD')).toBe('1.234');
		expect(csvText('-1+2')).toBe(`'-1+2`);
		expect(csvText('Anna')).toBe('Anna');
	});
});
