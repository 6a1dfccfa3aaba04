/**
 * Against the real MariaDB that `npm test` prepared: a cash-up per fair day (closing nothing), the
 * one recount a helper gets, a resent count stored once, and who may use a fair's booth.
 *
 * The access rule checked here: a fair's booth, sync API, booth orders and tally are for the
 * owner and the helpers the owner named for that fair; any other helper is answered 403
 * Forbidden (RFC 9110 §15.5.4: the server understood the request and refuses it to this user).
 */
import { eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import { createFair } from '$lib/server/fairs/fairs';
import { fairTally, saveTally } from '$lib/server/booth/tally';
import { setFairHelpers } from '$lib/server/fairs/fair-helpers';
import { fairFormSchema } from '$lib/fairs/schemas';
import { POST as salesPost } from '../../src/routes/api/booth/[fairId]/sales/+server';
import { POST as ordersPost } from '../../src/routes/api/booth/[fairId]/orders/+server';
import { POST as tallyPost } from '../../src/routes/api/booth/[fairId]/tally/+server';
import { demoStaff, testPiece, testUser, testWood } from '../helpers/fixtures';

const tag = `d${process.pid}${Date.now() % 100000}`;
const DAY1 = '2026-07-04';
const DAY2 = '2026-07-05';
let fairId = 0;
let fairStockId = 0;
let owner: { id: string; role: 'owner' };
let named: { id: string; role: 'helper' };
let other: { id: string; role: 'helper' };

async function cashSale(n: number, day: string, hour: number, totalMinor: number) {
	await db.insert(s.boothSales).values({
		id: `${tag}-s${n}`,
		fairId,
		kind: 'sale',
		method: 'cash',
		lines: [],
		subtotalMinor: totalMinor,
		totalMinor,
		soldAt: new Date(`${day}T${String(hour).padStart(2, '0')}:00:00Z`),
		receivedAt: new Date()
	});
}

beforeAll(async () => {
	const woodId = await testWood(`${tag}-w`);
	const pieceId = await testPiece(`${tag}-p`, [woodId], {
		title: 'Day ornament',
		kind: 'ornament',
		personalisable: false
	});
	({ owner, helper: named } = await demoStaff());
	other = {
		id: (await testUser(`${tag}-other@example.test`, 'helper', 'Other helper')).id,
		role: 'helper'
	};
	fairId = await createFair(
		fairFormSchema.parse({
			name: `${tag} two-day fair`,
			place: 'Test Hall',
			startsOn: DAY1,
			endsOn: DAY2,
			boothFee: '0',
			otherCosts: '0',
			salesTax: '0',
			cashFloat: '100',
			cardFee: '0',
			helperDiscount: '10',
			openHours: '16'
		})
	);
	[{ id: fairStockId }] = await db
		.insert(s.fairStock)
		.values({ fairId, pieceId, woodId, loadedOut: 5 })
		.$returningId();
	await setFairHelpers(fairId, [named.id]);
	// Day 1: 120.00 and 30.00 cash; day 2: 80.00 cash.
	await cashSale(1, DAY1, 10, 12_000);
	await cashSale(2, DAY1, 15, 3_000);
	await cashSale(3, DAY2, 11, 8_000);
});

describe('a cash-up per fair day', () => {
	it('counts each day against the float, and the fair stays open after day 1', async () => {
		// By hand (common practice): day 1 expects 100.00 float + 150.00 = 250.00, counted 250.00;
		// day 2 expects 100.00 + 80.00 = 180.00, counted 175.00, so 5.00 short.
		await saveTally(fairId, { day: DAY1, counts: {}, cashCountedMinor: 25_000 }, named);
		const afterDay1 = await fairTally(fairId);
		expect(afterDay1.fair.closedAt).toBeNull();
		expect(afterDay1.days.map((d) => d.result.cash.expected)).toEqual([25_000, 18_000]);
		expect(afterDay1.days[0].result.cash.difference).toBe(0);
		expect(afterDay1.days[1].tally).toBeNull();

		await saveTally(fairId, { day: DAY2, counts: {}, cashCountedMinor: 17_500 }, named);
		const t = await fairTally(fairId);
		expect(t.days[1].result.cash.difference).toBe(-500);
		// The whole fair: one float, 230.00 taken, 5.00 short in all.
		expect(t.result.cash.expected).toBe(10_000 + 23_000);
		expect(t.result.cash.difference).toBe(-500);
	});

	it('gives a helper one recount of a day, stores a resent count once, and lets the owner correct', async () => {
		// DAY2 was counted once above; a recount is the second and last for the helper.
		const first = await saveTally(
			fairId,
			{ day: DAY2, counts: { [fairStockId]: 4 }, cashCountedMinor: 18_000, saveId: `${tag}-r1` },
			named
		);
		expect(first.status).toBe('saved');
		const again = await saveTally(
			fairId,
			{ day: DAY2, counts: { [fairStockId]: 4 }, cashCountedMinor: 18_000, saveId: `${tag}-r1` },
			named
		);
		expect(again.status).toBe('duplicate');
		await expect(
			saveTally(fairId, { day: DAY2, counts: {}, cashCountedMinor: 17_000 }, named)
		).rejects.toMatchObject({ status: 409 });
		const t = await fairTally(fairId);
		const day2 = t.days[1];
		expect(day2.tally?.counts).toBe(2);
		expect(day2.tally?.firstCashCountedMinor).toBe(17_500);
		expect(day2.result.cash.difference).toBe(0);
		// Pieces after day 2: 5 loaded − 0 sold (the test sales carry no lines) = 5; counted 4.
		expect(day2.result.stock[0]).toMatchObject({ expectedLeft: 5, counted: 4, verdict: 'missing' });
		await saveTally(fairId, { day: DAY2, counts: {}, cashCountedMinor: 18_100 }, owner);
		expect((await fairTally(fairId)).days[1].result.cash.difference).toBe(100);
	});

	it('refuses a day that is not one of the fair’s days', async () => {
		await expect(saveTally(fairId, { day: '2026-07-09', counts: {} }, owner)).rejects.toMatchObject(
			{ status: 400 }
		);
	});

	it('stores one row for a day counted from two phones at once', async () => {
		const f2 = await createFair(
			fairFormSchema.parse({
				name: `${tag} race fair`,
				place: 'Test Hall',
				startsOn: DAY1,
				endsOn: DAY1,
				boothFee: '0',
				otherCosts: '0',
				salesTax: '0',
				cashFloat: '50',
				cardFee: '0',
				helperDiscount: '10',
				openHours: '8'
			})
		);
		const results = await Promise.allSettled([
			saveTally(f2, { day: DAY1, counts: {}, cashCountedMinor: 5_000 }, owner),
			saveTally(f2, { day: DAY1, counts: {}, cashCountedMinor: 5_000 }, owner)
		]);
		expect(results.every((r) => r.status === 'fulfilled')).toBe(true);
		const rows = await db.select().from(s.tallies).where(eq(s.tallies.fairId, f2));
		expect(rows).toHaveLength(1);
		expect(rows[0].counts).toBe(2);
	});
});

describe('fairs have their helpers', () => {
	const call = (
		handler: (event: never) => Promise<Response> | Response,
		user: { id: string; role: string },
		what: string,
		body: unknown
	) =>
		handler({
			locals: { user: { ...user, email: 'x', name: 'x' } },
			params: { fairId: String(fairId) },
			url: new URL(`http://test/api/booth/${fairId}/${what}`),
			request: new Request(`http://test/api/booth/${fairId}/${what}`, {
				method: 'POST',
				body: JSON.stringify(body)
			})
		} as never);

	it('answers 403 to a helper not named for the fair, on sales, booth orders and the tally', async () => {
		const sale = {
			id: `${tag}-refused-sale`,
			at: `${DAY1}T12:00:00Z`,
			lines: [{ pieceSlug: `${tag}-p`, woodSlug: `${tag}-w`, quantity: 1 }],
			discountMinor: 0,
			method: 'cash',
			tenderedMinor: null
		};
		const sales = await call(salesPost, other, 'sales', { sales: [sale] });
		expect(sales.status).toBe(403);
		expect(((await sales.json()) as { error: string }).error).toMatch(/not named as a helper/);
		const orders = await call(ordersPost, other, 'orders', { id: `${tag}-o` });
		expect(orders.status).toBe(403);
		const tally = await call(tallyPost, other, 'tally', {
			id: `${tag}-t-other`,
			day: DAY1,
			fields: { cashCounted: '1.00' }
		});
		expect(tally.status).toBe(403);
		const stored = await db.select().from(s.boothSales).where(eq(s.boothSales.id, sale.id));
		expect(stored).toHaveLength(0);
	});

	it('lets the named helper and the owner in, and refuses the helper again once taken off', async () => {
		const body = { id: `${tag}-t-named`, day: DAY1, fields: { cashCounted: '' } };
		// Day 1 was counted once by the named helper above: this is the recount.
		expect((await call(tallyPost, named, 'tally', body)).status).toBe(200);
		expect((await call(tallyPost, owner, 'tally', { ...body, id: `${tag}-t-owner` })).status).toBe(
			200
		);
		await setFairHelpers(fairId, []);
		expect(
			(await call(tallyPost, named, 'tally', { ...body, id: `${tag}-t-named-2` })).status
		).toBe(403);
		await setFairHelpers(fairId, [named.id]);
	});

	it('names only helper accounts', async () => {
		await expect(setFairHelpers(fairId, [owner.id])).rejects.toThrow(/helper accounts/);
	});
});
