/**
 * The catalogue version against the real MariaDB: a counter row bumped by triggers inside the
 * writer's transaction (drizzle/0011). Transaction semantics as the MariaDB manual states them
 * for InnoDB (a rolled-back transaction's trigger writes are undone with it; other sessions see
 * a change only once committed).
 */
import { eq, sql } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import { readVersion } from '$lib/server/catalogue/cache';

const tag = `cv${process.pid}${Date.now() % 100000}`;

describe('catalogue version', () => {
	it('moves with every write to what public pages show, in the same transaction', async () => {
		const before = await readVersion();
		await db.insert(s.settings).values({ key: `${tag}-a`, value: { n: 1 } });
		const afterInsert = await readVersion();
		expect(afterInsert).not.toBe(before);
		await db
			.update(s.settings)
			.set({ value: { n: 2 } })
			.where(eq(s.settings.key, `${tag}-a`));
		const afterUpdate = await readVersion();
		expect(afterUpdate).not.toBe(afterInsert);
		await db.delete(s.settings).where(eq(s.settings.key, `${tag}-a`));
		expect(await readVersion()).not.toBe(afterUpdate);

		const [piece] = await db
			.select({ id: s.pieces.id, title: s.pieces.title })
			.from(s.pieces)
			.limit(1);
		const v = await readVersion();
		await db.update(s.pieces).set({ title: piece.title }).where(eq(s.pieces.id, piece.id));
		// MariaDB fires row triggers for every row the UPDATE matched, changed or not.
		expect(await readVersion()).not.toBe(v);
	});

	it('rolls back with a write that is rolled back', async () => {
		const before = await readVersion();
		await expect(
			db.transaction(async (tx) => {
				await tx.insert(s.settings).values({ key: `${tag}-b`, value: 1 });
				throw new Error('changed my mind');
			})
		).rejects.toThrow('changed my mind');
		expect(await readVersion()).toBe(before);
	});

	it('ignores order status moves', async () => {
		const [order] = await db
			.select({ id: s.orders.id, status: s.orders.status })
			.from(s.orders)
			.limit(1);
		expect(order).toBeDefined();
		const before = await readVersion();
		await db.insert(s.orderHistory).values({
			orderId: order.id,
			fromStatus: order.status,
			toStatus: order.status,
			reason: `${tag} test note`,
			createdAt: new Date()
		});
		await db.update(s.orders).set({ status: order.status }).where(eq(s.orders.id, order.id));
		expect(await readVersion()).toBe(before);
		await db.execute(sql`DELETE FROM order_history WHERE reason = ${`${tag} test note`}`);
	});
});
