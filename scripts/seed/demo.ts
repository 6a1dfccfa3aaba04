/**
 * The demo scenario, an invented one: Hollis Marsh carves at the "Chipstall" workshop in the
 * (invented) town of Linden Ford, sells online and at two fairs, helped by Wren. Woods carry
 * their published Wood Handbook values (see src/lib/catalogue/woods.ts).
 *
 * This file only orchestrates: the scenario itself is plain data in ./data/, and the orders are
 * priced, taxed and snapshotted by the shop's own functions (./orders.ts). It lives in scripts/,
 * away from the request-serving code: only `npm start`, `npm test` and the seed script load it.
 */
import { count } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/mysql2';
import mysql from 'mysql2/promise';
import { hashPassword } from '../../src/lib/server/auth/password';
import * as schema from '../../src/lib/server/db/schema';
import { WORKSHOP } from '../../src/lib/server/db/schema';
import { adjustStock } from '../../src/lib/server/stock/adjust';
import { WOODS, densityAt12 } from '../../src/lib/catalogue/woods';
import { DEMO_ACCOUNTS } from './data/accounts';
import { DEMO_PIECES, DEMO_SHIPPING_RATES } from './data/pieces';
import { WOOD_ADD_ON } from './data/woods';
import { demoExtras } from './extras';
import type { DemoSeedResult, SeedDb } from './types';
import { DEMO_FORMAT, DEMO_WORDS, seedSettings } from './settings';
import { useShopFormat, useShopWords } from '../../src/lib/locale/shop-format';
import { seedDemoFairs } from './fairs';
import { daysFromNow, seedOrders } from './orders';

export { DEMO_ACCOUNTS };

/** Runs the demo seed in one transaction when the database has no pieces; true if it seeded. */
export async function seedDemo(db: SeedDb, now = new Date()): Promise<boolean> {
	const [{ n }] = await db.select({ n: count() }).from(schema.pieces);
	if (n > 0) return false;

	// Hashing is slow on purpose; do it before the transaction holds any locks.
	const hashes = await Promise.all(DEMO_ACCOUNTS.map((a) => hashPassword(a.password)));

	// The demo shop's clock and words, for the days and e-mails the seed itself works out.
	useShopFormat(DEMO_FORMAT);
	useShopWords(DEMO_WORDS);

	const seeded = await db.transaction(async (tx) => {
		const [{ n: again }] = await tx.select({ n: count() }).from(schema.pieces).for('update');
		if (again > 0) return null;

		const userIds: Record<string, string> = {};
		const existing = await tx
			.select({ id: schema.users.id, email: schema.users.email })
			.from(schema.users);
		for (const [i, a] of DEMO_ACCOUNTS.entries()) {
			const found = existing.find((u) => u.email === a.email);
			if (found) {
				userIds[a.email] = found.id;
				continue;
			}
			const id = crypto.randomUUID();
			await tx.insert(schema.users).values({
				id,
				email: a.email,
				name: a.name,
				passwordHash: hashes[i],
				role: a.role,
				createdAt: daysFromNow(-120, now),
				// The demo's people signed up through the e-mailed link long ago.
				emailConfirmedAt: daysFromNow(-120, now)
			});
			userIds[a.email] = id;
		}

		const woodIds: Record<string, number> = {};
		for (const w of WOODS) {
			const [{ id }] = await tx
				.insert(schema.woods)
				.values({
					slug: w.slug,
					name: w.name,
					botanicalName: w.botanicalName,
					specificGravityMilli: Math.round(w.specificGravity * 1000),
					densityKgM3: densityAt12(w.specificGravity),
					sideHardnessN: w.sideHardnessN,
					priceAddOnMinor: WOOD_ADD_ON[w.slug] ?? 0,
					toneLight: w.toneLight,
					toneDark: w.toneDark,
					character: w.character,
					caution: w.caution ?? null
				})
				.$returningId();
			woodIds[w.slug] = id;
		}

		const pieceIds: Record<string, number> = {};
		for (const p of DEMO_PIECES) {
			const [{ id }] = await tx
				.insert(schema.pieces)
				.values({
					slug: p.slug,
					title: p.title,
					kind: p.kind,
					summary: p.summary,
					description: p.description,
					lengthMm: p.size[0],
					widthMm: p.size[1],
					thicknessMm: p.size[2],
					basePriceMinor: p.basePriceMinor,
					currency: 'USD',
					personalisable: p.personalisable,
					foodContact: p.foodContact,
					leadDays: p.leadDays,
					pattern: p.pattern,
					active: true,
					createdAt: daysFromNow(-90, now)
				})
				.$returningId();
			pieceIds[p.slug] = id;
			await tx
				.insert(schema.pieceWoods)
				.values(p.woods.map((w) => ({ pieceId: id, woodId: woodIds[w] })));
			// The opening count goes through adjustStock, as every stock change does.
			for (const [w, quantity] of Object.entries(p.stock)) {
				if (quantity === 0) continue;
				await adjustStock(tx, {
					pieceId: id,
					woodId: woodIds[w],
					place: WORKSHOP,
					delta: quantity,
					reason: 'Opening count'
				});
			}
		}

		await tx.insert(schema.shippingRates).values(DEMO_SHIPPING_RATES);
		await tx.insert(schema.settings).values([
			{ key: 'salesTax', value: { rateBp: 0, basis: 'item' } },
			{ key: 'shopName', value: 'Chipstall' }
		]);

		await seedSettings(tx);
		await seedDemoFairs(tx, now, { pieceIds, woodIds, userIds });
		await seedOrders(tx, now, { pieceIds, woodIds, userIds });
		return { pieceIds, woodIds, userIds } satisfies DemoSeedResult;
	});
	if (!seeded) return false;

	for (const extra of demoExtras) {
		try {
			await extra.run(db, seeded);
		} catch (err) {
			console.warn(
				`Demo extra "${extra.name}" failed: ${err instanceof Error ? err.message : String(err)}`
			);
		}
	}
	return true;
}

/** Opens its own connection to `url`, seeds when empty, closes. Used by the scripts and tests. */
export async function seedDemoAt(url: string): Promise<boolean> {
	const conn = await mysql.createConnection({ uri: url, timezone: 'Z' });
	try {
		return await seedDemo(drizzle(conn, { schema, mode: 'default' }));
	} finally {
		await conn.end();
	}
}
