/**
 * Stock on the piece page against the real MariaDB: the owner's form action (zod, whole numbers,
 * a reason, never below zero), many changes sent at once, and the history with who and why.
 */
import { and, eq, sql } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import { pieceStock } from '$lib/server/stock/piece-stock';
import { testPiece, testWood } from '../helpers/fixtures';
import { actions } from '../../src/routes/workshop/pieces/[id]/+page.server';

const tag = `st${process.pid}${Date.now() % 100000}`;
let pieceId = 0;
let woodId = 0;
let otherWoodId = 0;
let closedFairId = 0;
let owner: { id: string; email: string; name: string; role: s.Role };

type Result = { status?: number; data?: Record<string, unknown> } & Record<string, unknown>;
const stockAction = actions.stock as (e: unknown) => Promise<Result>;

function post(fields: Record<string, string>, role: s.Role = 'owner', id = pieceId) {
	return stockAction({
		locals: { user: { ...owner, role } },
		url: new URL(`http://localhost/workshop/pieces/${id}?/stock`),
		params: { id: String(id) },
		request: new Request('http://localhost', {
			method: 'POST',
			body: new URLSearchParams(fields)
		})
	});
}

const change = (
	direction: 'add' | 'remove',
	count: string,
	extra: Record<string, string> = {}
) => ({
	woodId: String(woodId),
	place: 'workshop',
	direction,
	count,
	reason: 'Test change',
	...extra
});

async function onShelf() {
	const [row] = await db
		.select({ q: s.stock.quantity })
		.from(s.stock)
		.where(
			and(eq(s.stock.pieceId, pieceId), eq(s.stock.woodId, woodId), eq(s.stock.place, 'workshop'))
		);
	return row?.q ?? 0;
}

async function ledger() {
	const [row] = await db
		.select({
			n: sql<number>`count(*)`.mapWith(Number),
			sum: sql<number>`coalesce(sum(${s.stockAdjustments.delta}), 0)`.mapWith(Number)
		})
		.from(s.stockAdjustments)
		.where(and(eq(s.stockAdjustments.pieceId, pieceId), eq(s.stockAdjustments.woodId, woodId)));
	return row;
}

beforeAll(async () => {
	woodId = await testWood(`${tag}-a`);
	otherWoodId = await testWood(`${tag}-b`);
	pieceId = await testPiece(`${tag}-box`, [woodId], {
		title: 'Test box',
		kind: 'box',
		personalisable: false
	});
	[{ id: closedFairId }] = await db
		.insert(s.fairs)
		.values({
			name: `${tag} closed fair`,
			place: 'Hall',
			startsOn: '2025-10-04',
			endsOn: '2025-10-04',
			closedAt: new Date()
		})
		.$returningId();
	const [u] = await db.select().from(s.users).where(eq(s.users.role, 'owner')).limit(1);
	owner = { id: u.id, email: u.email, name: u.name, role: 'owner' };
});

describe('stock changes from the piece page', () => {
	it('refuses bad input with a clear message and writes nothing', async () => {
		const cases: [Record<string, string>, string, RegExp][] = [
			[change('add', '1.5'), 'count', /whole number/],
			[change('add', '-2'), 'count', /whole number/],
			[change('add', '0'), 'count', /at least 1/],
			[change('add', '2', { reason: '  ' }), 'reason', /why/],
			[change('add', '2', { place: 'garage' }), 'place', /where/],
			[change('add', '2', { direction: 'sideways' }), 'direction', /come in or go out/]
		];
		for (const [fields, key, message] of cases) {
			const r = await post(fields);
			expect(r.status, key).toBe(400);
			const errors = r.data!.errors as Record<string, string[]>;
			expect(errors[key][0]).toMatch(message);
		}
		// A wood the piece is not made in, and a fair that has closed.
		const wrongWood = await post(change('add', '1', { woodId: String(otherWoodId) }));
		expect(wrongWood.status).toBe(400);
		const closed = await post(change('add', '1', { place: `fair:${closedFairId}` }));
		expect(closed.status).toBe(409);
		expect((closed.data!.errors as Record<string, string[]>).place[0]).toMatch(/closed/);
		// Taking away more than is there: refused, with how many there are.
		const below = await post(change('remove', '1'));
		expect(below.status).toBe(409);
		expect((below.data!.errors as Record<string, string[]>).count[0]).toMatch(/Only 0 Test box/);
		expect(await ledger()).toEqual({ n: 0, sum: 0 });
		expect(await onShelf()).toBe(0);
	});

	it('is the owner’s: a helper gets 403, an unknown piece 404', async () => {
		await expect(post(change('add', '1'), 'helper')).rejects.toMatchObject({ status: 403 });
		await expect(post(change('add', '1'), 'owner', 999_999_001)).rejects.toMatchObject({
			status: 404
		});
		expect(await ledger()).toEqual({ n: 0, sum: 0 });
	});

	it('keeps count under many changes at once and never goes below zero', async () => {
		// Ten "one came in" sent together: each waits its turn on the locked row.
		const adds = await Promise.all(Array.from({ length: 10 }, () => post(change('add', '1'))));
		expect(adds.every((r) => r.stockSaved !== undefined)).toBe(true);
		expect(await onShelf()).toBe(10);
		// Fourteen "one went out" at once against ten on the shelf: exactly ten go through.
		const takes = await Promise.all(Array.from({ length: 14 }, () => post(change('remove', '1'))));
		expect(takes.filter((r) => r.stockSaved !== undefined)).toHaveLength(10);
		expect(takes.filter((r) => r.status === 409)).toHaveLength(4);
		expect(await onShelf()).toBe(0);
		// Perpetual inventory (common practice): the count on hand is the sum of its ledger.
		expect(await ledger()).toEqual({ n: 20, sum: 0 });
	});

	it('shows the counts and the history with who and why', async () => {
		const r = await post(change('add', '3', { reason: 'Carved three more' }));
		expect(r.stockSaved).toBe(3);
		const view = await pieceStock(pieceId);
		expect(view.woods.map((w) => w.id)).toEqual([woodId]);
		expect(view.places[0]).toMatchObject({ key: 'workshop', adjustable: true });
		expect(view.places.some((p) => p.key === `fair:${closedFairId}`)).toBe(false);
		expect(view.counts).toEqual([{ woodId, place: 'workshop', quantity: 3 }]);
		expect(view.history[0]).toMatchObject({
			delta: 3,
			reason: 'Carved three more',
			by: owner.name,
			placeName: 'Workshop shelf'
		});
		expect(view.history).toHaveLength(21);
	});
});
