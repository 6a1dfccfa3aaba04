/**
 * Foundation checks against the database `npm test` prepared: the server listens on loopback
 * only, the migrations made every table, and the demo seed is whole, consistent and idempotent.
 * The seed is checked in a scratch database of its own so other tests' writes cannot disturb it.
 */
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import { eq, inArray, isNotNull } from 'drizzle-orm';
import mysql from 'mysql2/promise';
import * as schema from '$lib/server/db/schema';
import { getTableConfig } from 'drizzle-orm/mysql-core';
import { config } from '$lib/server/config';
import { runMigrations } from '$lib/server/db/migrate';
import { seedDemo, DEMO_ACCOUNTS } from '../../scripts/seed/demo';
import { verifyPassword } from '$lib/server/auth/password';
import { carvingQueue } from '$lib/server/queue/carving-queue';
import { readyAfterCarving } from '$lib/queue/carving-queue';

const mainUrl = new URL(config.db.url);
const scratchName = `${mainUrl.pathname.slice(1)}_seed${process.pid}`;
const scratchUrl = new URL(mainUrl);
scratchUrl.pathname = `/${scratchName}`;

let server: mysql.Connection;
let conn: mysql.Connection;
let db: MySql2Database<typeof schema>;

beforeAll(async () => {
	const serverUrl = new URL(mainUrl);
	serverUrl.pathname = '/';
	server = await mysql.createConnection({ uri: serverUrl.toString() });
	await server.query(`DROP DATABASE IF EXISTS ${mysql.escapeId(scratchName)}`);
	await server.query(`CREATE DATABASE ${mysql.escapeId(scratchName)}`);
	await runMigrations(scratchUrl.toString());
	conn = await mysql.createConnection({ uri: scratchUrl.toString(), timezone: 'Z' });
	db = drizzle(conn, { schema, mode: 'default' });
});

afterAll(async () => {
	await conn?.end();
	await server?.query(`DROP DATABASE IF EXISTS ${mysql.escapeId(scratchName)}`);
	await server?.end();
});

/** Listening TCP sockets on a port, from the kernel's own table (no `ss` needed). */
function listenersOn(port: number): string[] {
	const found: string[] = [];
	for (const file of ['/proc/net/tcp', '/proc/net/tcp6']) {
		let text = '';
		try {
			text = readFileSync(file, 'utf8');
		} catch {
			continue;
		}
		for (const line of text.trim().split('\n').slice(1)) {
			const [, local, , state] = line.trim().split(/\s+/);
			const [addr, hexPort] = local.split(':');
			if (state === '0A' && parseInt(hexPort, 16) === port) found.push(addr);
		}
	}
	return found;
}

describe('MariaDB server', () => {
	it('listens on 127.0.0.1 only', async () => {
		const [rows] = await server.query("SHOW VARIABLES LIKE 'bind_address'");
		expect((rows as { Value: string }[])[0].Value).toBe('127.0.0.1');
		if (mainUrl.hostname === '127.0.0.1' || mainUrl.hostname === 'localhost') {
			const addrs = listenersOn(Number(mainUrl.port || 3306));
			expect(addrs.length).toBeGreaterThan(0);
			// 0100007F is 127.0.0.1 in /proc/net/tcp's little-endian hex.
			expect(addrs.every((a) => a === '0100007F')).toBe(true);
		}
	});

	it('has every table of the schema after migrating', async () => {
		const [rows] = await conn.query('SHOW TABLES');
		const tables = (rows as Record<string, string>[]).map((r) => Object.values(r)[0]);
		for (const t of Object.values(schema)) {
			if (t && typeof t === 'object' && Symbol.for('drizzle:IsDrizzleTable') in t) {
				expect(tables).toContain(getTableConfig(t as never).name);
			}
		}
		expect(tables).toContain('__drizzle_migrations');
	});
});

describe('demo seed', () => {
	let seededFirst = false;
	beforeAll(async () => {
		seededFirst = await seedDemo(db, new Date('2026-03-01T12:00:00Z'));
	}, 60_000);

	it('seeds an empty database once and leaves a seeded one alone', async () => {
		expect(seededFirst).toBe(true);
		expect(await seedDemo(db)).toBe(false);
		const pieces = await db.select().from(schema.pieces);
		expect(pieces).toHaveLength(8);
		expect(new Set(pieces.map((p) => p.kind)).size).toBeGreaterThanOrEqual(5);
	});

	it('stores wood densities at 12 % MC from the Wood Handbook specific gravities', async () => {
		// Specific gravity G and side hardness at 12 % MC: USDA FPL Wood Handbook (FPL-GTR-190,
		// 2010, Table 5-3a; FPL-GTR-282, 2021, Table 5-3b). Density ρ = 1000·G·(1 + 0.12) kg/m³,
		// the handbook's relation between specific gravity and density at a moisture content.
		const handbook: Record<string, { g: number; hardnessN: number; rho: number }> = {
			basswood: { g: 0.37, hardnessN: 1800, rho: 414 },
			butternut: { g: 0.38, hardnessN: 2200, rho: 426 },
			cherry: { g: 0.5, hardnessN: 4200, rho: 560 },
			walnut: { g: 0.55, hardnessN: 4500, rho: 616 },
			maple: { g: 0.63, hardnessN: 6400, rho: 706 }
		};
		const rows = await db.select().from(schema.woods);
		expect(rows.map((w) => w.slug).sort()).toEqual(Object.keys(handbook).sort());
		for (const w of rows) {
			const h = handbook[w.slug];
			expect(w.specificGravityMilli).toBe(Math.round(h.g * 1000));
			expect(w.densityKgM3).toBe(Math.round(1000 * h.g * 1.12));
			expect(w.densityKgM3).toBe(h.rho);
			expect(w.sideHardnessN).toBe(h.hardnessN);
		}
	});

	it('hashes the demo passwords with argon2id and they verify', async () => {
		const users = await db.select().from(schema.users);
		for (const a of DEMO_ACCOUNTS) {
			const u = users.find((x) => x.email === a.email)!;
			expect(u.role).toBe(a.role);
			expect(u.passwordHash.startsWith('$argon2id$')).toBe(true);
			expect(await verifyPassword(u.passwordHash, a.password)).toBe(true);
			expect(await verifyPassword(u.passwordHash, a.password + 'x')).toBe(false);
			expect(u.id).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
		}
	});

	it('has fourteen orders across every status, with sums that add up', async () => {
		const orders = await db.select().from(schema.orders);
		// Thirteen online orders and one taken at the open fair with a deposit.
		expect(orders).toHaveLength(14);
		expect(new Set(orders.map((o) => o.status))).toEqual(new Set(schema.orderStatuses));
		const lines = await db.select().from(schema.orderLines);
		const shipments = await db.select().from(schema.shipments);
		for (const o of orders) {
			const mine = lines.filter((l) => l.orderId === o.id);
			expect(mine.length).toBeGreaterThan(0);
			for (const l of mine) expect(l.lineTotalMinor).toBe(l.unitPriceMinor * l.quantity);
			expect(o.subtotalMinor).toBe(mine.reduce((a, l) => a + l.lineTotalMinor, 0));
			expect(o.totalMinor).toBe(o.subtotalMinor + o.shippingMinor + o.taxMinor);
			expect(shipments.some((s) => s.orderId === o.id)).toBe(o.status === 'shipped');
			expect(o.refundedMinor).toBe(o.status === 'refunded' ? o.totalMinor : 0);
		}
		expect(lines.some((l) => l.personalisation?.initials)).toBe(true);
	});

	it('has a booth order with a deposit, the balance still owed, and ready-by dates from the queue', async () => {
		const [booth] = await db
			.select()
			.from(schema.orders)
			.where(isNotNull(schema.orders.depositMinor));
		// Deposit taken, balance due: its own state until the balance is paid.
		expect(booth.status).toBe('deposit_held');
		expect(booth.depositMinor).toBeGreaterThan(0);
		expect(booth.depositMinor).toBeLessThan(booth.totalMinor);
		expect(booth.balancePaidAt).toBeNull();
		const [entry] = await db
			.select()
			.from(schema.boothSales)
			.where(eq(schema.boothSales.orderId, booth.id));
		expect(entry).toMatchObject({ kind: 'deposit', totalMinor: booth.depositMinor });
		// Every queued order (paid or on the bench, with a line to carve) is dated by the queue.
		const queue = await db.transaction((tx) => carvingQueue(new Date(), tx));
		const dated = await db
			.select({ id: schema.orders.id, readyBy: schema.orders.readyBy })
			.from(schema.orders)
			.where(inArray(schema.orders.id, [0, ...queue.lines.map((l) => l.orderId)]));
		expect(dated.map((o) => o.id)).toContain(booth.id);
		for (const o of dated) {
			const last = queue.lines.filter((l) => l.orderId === o.id).at(-1)!;
			expect(o.readyBy).toBe(readyAfterCarving(last.carvedOn!, queue.schedule, queue.daysOff));
		}
	});

	it('has two closed fairs (one that does not add up) and one open fair with pieces loaded out', async () => {
		const fairs = await db.select().from(schema.fairs);
		expect(fairs).toHaveLength(3);
		const closed = fairs.filter((f) => f.closedAt);
		expect(closed).toHaveLength(2);
		const open = fairs.find((f) => !f.closedAt)!;
		const openStock = await db
			.select()
			.from(schema.fairStock)
			.where(eq(schema.fairStock.fairId, open.id));
		expect(openStock.reduce((a, l) => a + l.loadedOut, 0)).toBeGreaterThan(0);
		const gapsByFair: number[][] = [];
		const cashGaps: number[] = [];
		for (const past of closed) {
			expect(past.boothFeeMinor).toBeGreaterThan(0);
			const sales = await db
				.select()
				.from(schema.boothSales)
				.where(eq(schema.boothSales.fairId, past.id));
			expect(sales.length).toBeGreaterThan(0);
			for (const s of sales) {
				const sub = s.lines.reduce((a, l) => a + l.unitPriceMinor * l.quantity, 0);
				expect(s.subtotalMinor).toBe(sub);
				const after = sub - s.discountMinor;
				// Basis points: 1 bp = 0.01 % (common practice); tax added to, or held inside, the price.
				const tax = past.pricesIncludeTax
					? after - Math.round((after * 10_000) / (10_000 + past.salesTaxBp))
					: Math.round((after * past.salesTaxBp) / 10_000);
				expect(s.taxMinor).toBe(tax);
				expect(s.totalMinor).toBe(past.pricesIncludeTax ? after : after + tax);
			}
			// Expected cash at close = float + cash takings (common practice).
			const cash = sales.filter((s) => s.method === 'cash').reduce((a, s) => a + s.totalMinor, 0);
			const [tally] = await db
				.select()
				.from(schema.tallies)
				.where(eq(schema.tallies.fairId, past.id));
			cashGaps.push(tally.cashCountedMinor! - (past.cashFloatMinor + cash));
			const fairStock = await db
				.select()
				.from(schema.fairStock)
				.where(eq(schema.fairStock.fairId, past.id));
			const soldOf = (pieceId: number, woodId: number) =>
				sales
					.flatMap((s) => s.lines)
					.filter((l) => l.pieceId === pieceId && l.woodId === woodId)
					.reduce((a, l) => a + l.quantity, 0);
			// Expected left = loaded − sold (common practice).
			gapsByFair.push(
				fairStock
					.map((f) => f.loadedOut - soldOf(f.pieceId, f.woodId) - (f.countedBack ?? 0))
					.filter((g) => g !== 0)
			);
		}
		// One fair adds up; the other has one piece missing and the cash 5.00 short.
		expect(gapsByFair.sort((a, b) => a.length - b.length)).toEqual([[], [1]]);
		expect(cashGaps.sort((a, b) => a - b)).toEqual([-500, 0]);
		const stockRows = await db.select().from(schema.stock);
		expect(stockRows.every((r) => r.quantity >= 0)).toBe(true);
		expect(await db.select().from(schema.shippingRates)).toHaveLength(12);
	});
});
