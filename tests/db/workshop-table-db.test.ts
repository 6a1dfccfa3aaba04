/**
 * The workshop's order table against the real MariaDB: per-order personalised counts (each
 * order its own figure, counted by hand below), filters, search, sort and paging in SQL, the
 * API's query validation, and the role checks on the API and the owner-only refund.
 */
import { eq, like } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import { testLine, testOrder } from '../helpers/fixtures';
import { listWorkshopOrders } from '$lib/server/orders/table';
import { carvingQueue, queueLines, recomputeReadyBy } from '$lib/server/queue/carving-queue';
import { todaySummary } from '$lib/server/workshop/today';
import { readyAfterCarving } from '$lib/queue/carving-queue';
import {
	orderTableQuery,
	parseOrderTableQuery,
	tableStateFromUrl,
	tableStateToParams
} from '$lib/orders/workshop-orders-schema';
import { GET } from '../../src/routes/api/workshop/orders/+server';
import { actions } from '../../src/routes/workshop/orders/[ref]/+page.server';

const tag = `T${process.pid % 1000}${Date.now() % 1000}`;
let pieceId = 0;
let woodId = 0;
const snap = {
	initials: 'AB',
	style: 'classic',
	diameterMm: 60,
	count: 1,
	spacingMm: 0,
	split: false,
	estimateMinutes: 40
};

/** An order with `personal` personalised lines and `ready` ready-made ones. */
async function make(i: number, personal: number, ready: number, total: number) {
	const line = (personalised: boolean) =>
		testLine(pieceId, woodId, 1000, {
			title: 'Plate',
			woodName: 'Basswood',
			fromStock: !personalised,
			personalisation: personalised ? snap : null
		});
	await testOrder(
		{
			ref: `${tag}-${i}`,
			email: `table-${tag}-${i}@example.test`.toLowerCase(),
			buyerName: `Tabitha ${tag} ${i}`,
			address: { line1: '1 Mill St', city: 'Linden Ford', postcode: '05001', country: 'US' },
			totalMinor: total,
			createdAt: new Date(Date.UTC(2026, 2, i))
		},
		[
			...Array.from({ length: personal }, () => line(true)),
			...Array.from({ length: ready }, () => line(false))
		]
	);
}

const q = (over: Record<string, string>) => orderTableQuery.parse({ q: tag, ...over });

beforeAll(async () => {
	[{ id: pieceId }] = await db.select({ id: s.pieces.id }).from(s.pieces).limit(1);
	[{ id: woodId }] = await db.select({ id: s.woods.id }).from(s.woods).limit(1);
	// Hand count: order 1 has 2 personalised, order 2 none, order 3 one, order 4 three.
	await make(1, 2, 1, 5000);
	await make(2, 0, 2, 2000);
	await make(3, 1, 0, 9000);
	await make(4, 3, 0, 1000);
});

afterAll(async () => {
	await db.delete(s.orders).where(like(s.orders.ref, `${tag}-%`));
});

describe('workshop order table', () => {
	it('counts personalised pieces per order, not one figure for all', async () => {
		const { rows, total } = await listWorkshopOrders(q({ sort: 'ref', dir: 'asc' }));
		expect(total).toBe(4);
		expect(rows.map((r) => [r.ref, r.personalised, r.toCarve])).toEqual([
			[`${tag}-1`, 2, 2],
			[`${tag}-2`, 0, 0],
			[`${tag}-3`, 1, 1],
			[`${tag}-4`, 3, 3]
		]);
	});

	it('filters personalised or not, sorts by any column and pages', async () => {
		const no = await listWorkshopOrders(q({ personalised: 'no' }));
		expect(no.rows.map((r) => r.ref)).toEqual([`${tag}-2`]);
		const byTotal = await listWorkshopOrders(q({ sort: 'totalMinor', dir: 'asc' }));
		expect(byTotal.rows.map((r) => r.totalMinor)).toEqual([1000, 2000, 5000, 9000]);
		const byCount = await listWorkshopOrders(q({ sort: 'personalised', dir: 'desc' }));
		expect(byCount.rows.map((r) => r.personalised)).toEqual([3, 2, 1, 0]);
		const page2 = await listWorkshopOrders(q({ sort: 'ref', dir: 'asc', size: '10', page: '1' }));
		expect(page2.pages).toBe(1);
		const dated = await listWorkshopOrders(q({ from: '2026-03-02', to: '2026-03-03' }));
		expect(dated.rows.map((r) => r.ref).sort()).toEqual([`${tag}-2`, `${tag}-3`]);
	});

	it('searches by e-mail and treats % and _ literally', async () => {
		const byMail = await listWorkshopOrders(
			orderTableQuery.parse({ q: `table-${tag}-3@`.toLowerCase() })
		);
		expect(byMail.rows.map((r) => r.ref)).toEqual([`${tag}-3`]);
		expect((await listWorkshopOrders(orderTableQuery.parse({ q: `${tag}%` }))).total).toBe(0);
	});

	it('keeps the whole state in the URL and falls back field by field on a bad bookmark', () => {
		const state = tableStateFromUrl(
			new URLSearchParams('sort=totalMinor&dir=asc&status=paid,packed&size=999&q=ab')
		);
		expect(state).toMatchObject({
			sort: 'totalMinor',
			dir: 'asc',
			status: ['paid', 'packed'],
			size: 25,
			q: 'ab'
		});
		expect(tableStateToParams(state).toString()).toBe(
			'sort=totalMinor&dir=asc&status=paid%2Cpacked&q=ab'
		);
		expect(parseOrderTableQuery(new URLSearchParams('sort=password')).success).toBe(false);
	});
});

describe('carving queue and Today', () => {
	it('queues only made-to-order lines; a ready-made order is to pack, never to carve', async () => {
		const lines = await queueLines();
		const mine = lines.filter((l) => l.ref.startsWith(`${tag}-`));
		// Hand count: 2 + 1 + 3 personalised lines, none from order 2; 40 min each (snapshot).
		expect(mine.map((l) => l.ref).sort()).toEqual([
			`${tag}-1`,
			`${tag}-1`,
			`${tag}-3`,
			`${tag}-4`,
			`${tag}-4`,
			`${tag}-4`
		]);
		expect(mine.every((l) => l.minutes === 40)).toBe(true);
		const today = await todaySummary();
		const refs = (list: { ref: string }[]) =>
			list.map((o) => o.ref).filter((r) => r.startsWith(`${tag}-`));
		expect(refs(today.steps.carve).sort()).toEqual([`${tag}-1`, `${tag}-3`, `${tag}-4`]);
		expect(refs(today.steps.pack)).toEqual([`${tag}-2`]);
	});

	it('dates each queued order from its place in the queue', async () => {
		await recomputeReadyBy();
		const q = await carvingQueue();
		const [o4] = await db
			.select()
			.from(s.orders)
			.where(eq(s.orders.ref, `${tag}-4`));
		const last = q.lines.filter((l) => l.ref === `${tag}-4`).at(-1)!;
		expect(last.carvedOn).not.toBeNull();
		expect(o4.readyBy).toBe(readyAfterCarving(last.carvedOn!, q.schedule, q.daysOff));
		expect(o4.readyBy! > last.carvedOn!).toBe(true);
	});
});

type Ev = Parameters<typeof GET>[0];
const user = (role: s.Role) => ({ id: 'u', email: 'x@example.test', name: 'X', role });

describe('roles and query validation', () => {
	it('answers 400 for a bad query, 403 for a customer, 200 for a helper', async () => {
		const call = (role: s.Role | null, qs: string) =>
			GET({
				locals: { user: role ? user(role) : null },
				url: new URL(`http://localhost/api/workshop/orders?${qs}`)
			} as unknown as Ev);
		const bad = await call('helper', 'page=0');
		expect(bad.status).toBe(400);
		expect(((await bad.json()) as { fields: Record<string, string[]> }).fields.page).toBeDefined();
		await expect(call('customer', '')).rejects.toMatchObject({ status: 403 });
		await expect(call(null, '')).rejects.toMatchObject({ status: 401 });
		const ok = await call('helper', `q=${tag}`);
		expect(((await ok.json()) as { total: number }).total).toBe(4);
	});

	it('a helper cannot refund: 403 before anything is read or sent', async () => {
		const [o] = await db
			.select()
			.from(s.orders)
			.where(eq(s.orders.ref, `${tag}-1`));
		const event = {
			locals: { user: user('helper') },
			url: new URL(`http://localhost/workshop/orders/${o.ref}?/refund`),
			params: { ref: o.ref },
			request: new Request('http://localhost', {
				method: 'POST',
				body: new URLSearchParams({ kind: 'full', reason: 'x y z' })
			})
		};
		await expect((actions.refund as (e: unknown) => Promise<unknown>)(event)).rejects.toMatchObject(
			{ status: 403 }
		);
		expect(await db.select().from(s.orderRefunds).where(eq(s.orderRefunds.orderId, o.id))).toEqual(
			[]
		);
	});
});
