/**
 * Initials too small to carve are refused by the server against the real MariaDB: adding to the
 * basket answers 400 and writes no line (also under concurrent requests), a line stored before
 * the check cannot have its quantity raised, and checkout refuses it with a 4xx and writes no
 * order.
 */
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import { addLine, setQuantity } from '$lib/server/cart';
import { createPendingOrder } from '$lib/server/orders/place';
import { testPiece, testWood } from '../helpers/fixtures';
import type { CheckoutInput } from '$lib/cart/checkout-schema';
import { DomainError } from '$lib/server/errors/domain-error';

/** What a call threw, for checking; fails the test when it did not throw. */
async function thrown<E>(p: Promise<unknown>, kind: new (...a: never[]) => E): Promise<E> {
	const err: unknown = await p.then(
		() => null,
		(e: unknown) => e
	);
	expect(err).toBeInstanceOf(kind);
	return err as E;
}

const tag = `lr${process.pid}${Date.now() % 100000}`;
let pieceId = 0;
let woodId = 0;
const email = `${tag}@example.test`;

async function newCart() {
	const id = crypto.randomUUID();
	const now = new Date();
	await db.insert(s.carts).values({ id, createdAt: now, updatedAt: now });
	return id;
}
const linesOf = (cartId: string) =>
	db.select().from(s.cartLines).where(eq(s.cartLines.cartId, cartId));

beforeAll(async () => {
	// An unknown wood slug takes basswood's limits: 6 mm letters, 1.2 mm strokes (common practice).
	woodId = await testWood(`${tag}-wood`);
	pieceId = await testPiece(`${tag}-plate`, [woodId], {
		title: 'Test plate',
		kind: 'plate',
		personalisable: true
	});
	// The demo serving plate's rosettes: 36 mm, five in a band.
	await db
		.update(s.pieces)
		.set({ lengthMm: 280, widthMm: 280, pattern: { diameterMm: 36, count: 5, spacingMm: 18 } })
		.where(eq(s.pieces.id, pieceId));
});

afterAll(async () => {
	await db.delete(s.orders).where(eq(s.orders.email, email));
});

const add = (cartId: string, initials: string, style?: string) =>
	addLine(cartId, { slug: `${tag}-plate`, wood: `${tag}-wood`, quantity: 1, initials, style });

describe('the server refuses initials too small to carve', () => {
	it('adding "AB" to a 36 mm rosette in basswood is a 400 naming the minimum, and writes nothing', async () => {
		const cart = await newCart();
		const err = await thrown(add(cart, 'AB'), DomainError);
		expect(err.status).toBe(400);
		// 5.0 mm letters on this rosette against 6 mm in basswood (common practice).
		expect(err.message).toMatch(/at least 6 mm tall/);
		expect(err.fields?.initials[0]).toBe(err.message);
		expect(await linesOf(cart)).toHaveLength(0);
	});

	it('refuses concurrent adds alike, writing no line', async () => {
		const cart = await newCart();
		const results = await Promise.allSettled([add(cart, 'AB'), add(cart, 'ABC'), add(cart, 'WM')]);
		for (const r of results) {
			expect(r.status).toBe('rejected');
			expect(((r as PromiseRejectedResult).reason as DomainError).status).toBe(400);
		}
		expect(await linesOf(cart)).toHaveLength(0);
	});

	it('accepts the same letters in the open-centre style, and one letter in the classic', async () => {
		const cart = await newCart();
		await add(cart, 'AB', 'open');
		await add(cart, 'A', 'classic');
		const lines = await linesOf(cart);
		expect(lines.map((l) => l.personalisation?.initials).sort()).toEqual(['A', 'AB']);
		expect(
			lines.find((l) => l.personalisation?.initials === 'AB')!.personalisation!.medallionRatio
		).toBe(0.6);
	});

	it('a too-small line stored before the check: quantity change 400, checkout 409, no order', async () => {
		const cart = await newCart();
		const lineId = await add(cart, 'AB', 'open');
		// As a line from before the rule: the classic medallion with the same letters.
		const [line] = await linesOf(cart);
		await db
			.update(s.cartLines)
			.set({
				personalisation: { ...line.personalisation!, style: 'classic', medallionRatio: 0.42 }
			})
			.where(eq(s.cartLines.id, lineId));

		const q = await thrown(setQuantity(cart, lineId, 2), DomainError);
		expect(q.status).toBe(400);
		expect((await linesOf(cart))[0].quantity).toBe(1);

		const buyer: CheckoutInput = {
			name: 'Letter Tester',
			email,
			line1: '1 Test Lane',
			city: 'Boulder',
			region: 'CO',
			postcode: '80302',
			country: 'US'
		};
		const before = await db.select({ id: s.orders.id }).from(s.orders);
		const err = await thrown(createPendingOrder(cart, buyer, null), DomainError);
		expect(err.status).toBeGreaterThanOrEqual(400);
		expect(err.status).toBeLessThan(500);
		expect(err.message).toMatch(/too small to cut cleanly.*6 mm tall/);
		const after = await db.select({ id: s.orders.id }).from(s.orders);
		expect(after.length).toBe(before.length);
	});
});
