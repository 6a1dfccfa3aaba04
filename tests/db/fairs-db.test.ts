/**
 * Fairs against the real MariaDB that `npm test` prepared: load-out through stock adjustments,
 * the booth sync (each sale stored once, also under concurrent sends; partial acceptance; limits),
 * the booth order with deposit, closing once, and the CSV read back by a general-purpose parser.
 */
import { and, eq, inArray } from 'drizzle-orm';
import Papa from 'papaparse';
import { beforeAll, describe, expect, it } from 'vitest';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import { demoStaff, testPiece, testStock, testWood } from '../helpers/fixtures';
import { createFair } from '$lib/server/fairs/fairs';
import { loadOut } from '$lib/server/fairs/load-out';
import { syncSales } from '$lib/server/booth/sync';
import { placeBoothOrder } from '$lib/server/booth/order';
import { closeFair, fairTally, saveTally } from '$lib/server/booth/tally';
import { fairCsv, fairReport } from '$lib/server/booth/fair-report';
import { moneyCsv, moneyReport } from '$lib/server/booth/money-report';
import { checklistPdf } from '$lib/server/fairs/checklist-pdf';
import { PDFDocument } from 'pdf-lib';
import { setFairHelpers } from '$lib/server/fairs/fair-helpers';
import { fairFormSchema, countSchema } from '$lib/fairs/schemas';
import { POST } from '../../src/routes/api/booth/[fairId]/sales/+server';
import { DomainError } from '$lib/server/errors/domain-error';

const tag = `f${process.pid}${Date.now() % 100000}`;
let pieceId = 0;
let woodId = 0;
let fairId = 0;
let owner: { id: string; role: 'owner' };
let helper: { id: string; role: 'helper' };
const pieceSlug = `${tag}-orn`;
const woodSlug = `${tag}-wood`;

async function qty(place: string) {
	const [row] = await db
		.select({ q: s.stock.quantity })
		.from(s.stock)
		.where(and(eq(s.stock.pieceId, pieceId), eq(s.stock.woodId, woodId), eq(s.stock.place, place)));
	return row?.q ?? 0;
}

// One time for every sale here: a resend carries the time it was made, like the phone's.
const AT = new Date(Date.now() - 60_000).toISOString();
const sale = (n: number, extra: Record<string, unknown> = {}) => ({
	id: `${tag}-sale-${String(n).padStart(4, '0')}`,
	at: AT,
	lines: [{ pieceSlug, woodSlug, quantity: 1 }],
	discountMinor: 0,
	method: 'cash',
	tenderedMinor: 5000,
	...extra
});

beforeAll(async () => {
	woodId = await testWood(woodSlug, { name: 'Test basswood' });
	pieceId = await testPiece(pieceSlug, [woodId], {
		title: 'Test ornament',
		kind: 'ornament',
		personalisable: true
	});
	await testStock(pieceId, woodId, 40);
	({ owner, helper } = await demoStaff());
	const form = fairFormSchema.parse({
		name: `${tag} fair`,
		place: 'Test Hall',
		// The fair runs today: sales are dated now, and a sale outside the fair's days is refused.
		startsOn: new Date().toISOString().slice(0, 10),
		endsOn: new Date().toISOString().slice(0, 10),
		boothFee: '60',
		otherCosts: '15.00',
		salesTax: '7.25',
		cashFloat: '100',
		cardFee: '2.6',
		helperDiscount: '10',
		openHours: '8'
	});
	fairId = await createFair(form);
	// Fairs have their own helpers: this one sells here.
	await setFairHelpers(fairId, [helper.id]);
});

describe('load-out', () => {
	it('moves stock from the workshop to the fair with two adjustments per line', async () => {
		await loadOut(fairId, [{ pieceId, woodId, quantity: 30 }], owner.id);
		expect(await qty('workshop')).toBe(10);
		expect(await qty(`fair:${fairId}`)).toBe(30);
		const adj = await db
			.select()
			.from(s.stockAdjustments)
			.where(eq(s.stockAdjustments.pieceId, pieceId));
		expect(adj.map((a) => a.delta).sort((a, b) => a - b)).toEqual([-30, 30]);
	});

	it('refuses a load-out larger than the shelf and changes nothing', async () => {
		await expect(loadOut(fairId, [{ pieceId, woodId, quantity: 11 }], owner.id)).rejects.toThrow(
			DomainError
		);
		expect(await qty('workshop')).toBe(10);
	});
});

describe('booth sync', () => {
	it('keeps the good sales of a batch and reports the broken one', async () => {
		const batch = [
			sale(1),
			sale(2, { lines: [{ pieceSlug: 'no-such', woodSlug, quantity: 1 }] }),
			sale(3, { quantity: -1, discountMinor: 'x' })
		];
		const a = await syncSales(fairId, batch, helper);
		expect(a.accepted).toEqual([sale(1).id]);
		expect(a.rejected.map((r) => r.id)).toEqual([sale(2).id, sale(3).id]);
		expect(a.rejected[0].error).toMatch(/not loaded out/);
		// 20.00 + 7.25 % = 21.45 (worked by hand, tax added per sale, half-up).
		const [row] = await db
			.select()
			.from(s.boothSales)
			.where(eq(s.boothSales.id, sale(1).id));
		expect(row.totalMinor).toBe(2145);
		expect(await qty(`fair:${fairId}`)).toBe(29);
	});

	it('stores each sale once: resent, and sent five times at once', async () => {
		const again = await syncSales(fairId, [sale(1)], helper);
		expect(again).toEqual({ accepted: [], duplicate: [sale(1).id], late: [], rejected: [] });
		const batch = Array.from({ length: 10 }, (_, i) =>
			sale(100 + i, { method: i % 2 ? 'card' : 'cash' })
		);
		const answers = await Promise.all(
			Array.from({ length: 5 }, () => syncSales(fairId, batch, helper))
		);
		const accepted = answers.flatMap((a) => a.accepted);
		expect(accepted.sort()).toEqual(batch.map((b) => b.id).sort());
		expect(answers.flatMap((a) => a.duplicate)).toHaveLength(40);
		const rows = await db
			.select({ id: s.boothSales.id })
			.from(s.boothSales)
			.where(
				inArray(
					s.boothSales.id,
					batch.map((b) => b.id)
				)
			);
		expect(rows).toHaveLength(10);
		expect(await qty(`fair:${fairId}`)).toBe(19);
	});

	it('holds helpers to the discount limit, not the owner', async () => {
		// 10 % of 20.00 = 2.00 at most for a helper.
		const over = await syncSales(fairId, [sale(200, { discountMinor: 201 })], helper);
		expect(over.rejected[0].error).toMatch(/limit/);
		const ok = await syncSales(fairId, [sale(201, { discountMinor: 500 })], owner);
		expect(ok.accepted).toHaveLength(1);
	});

	it('stores and flags a sale that takes fair stock below zero', async () => {
		const big = await syncSales(
			fairId,
			[sale(300, { lines: [{ pieceSlug, woodSlug, quantity: 18 }], tenderedMinor: null })],
			owner
		);
		expect(big.accepted).toHaveLength(1);
		// 19 − 1 (the owner's discounted sale) − 18 = 0: not below zero, so not flagged.
		const [last] = await db
			.select()
			.from(s.boothSales)
			.where(eq(s.boothSales.id, sale(300).id));
		expect(last.flagged).toBe(false);
		const flagged = await syncSales(fairId, [sale(301, { tenderedMinor: null })], owner);
		expect(flagged.accepted).toHaveLength(1);
		const [row] = await db
			.select()
			.from(s.boothSales)
			.where(eq(s.boothSales.id, sale(301).id));
		expect(row.flagged).toBe(true);
		expect(await qty(`fair:${fairId}`)).toBe(-1);
	});

	it('answers a batch of 5,000 entries and a 5 MB body with a 413 and stores nothing', async () => {
		const call = (body: string) =>
			POST({
				locals: { user: { ...helper, email: 'x', name: 'x', createdAt: new Date() } },
				params: { fairId: String(fairId) },
				url: new URL(`http://test/api/booth/${fairId}/sales`),
				request: new Request(`http://test/api/booth/${fairId}/sales`, { method: 'POST', body })
			} as never);
		const many = Array.from({ length: 5000 }, (_, i) => sale(10_000 + i));
		const r1 = await call(JSON.stringify({ sales: many }));
		expect(r1.status).toBe(413);
		expect(((await r1.json()) as { error: string }).error).toMatch(/at most 1000 sales/);
		const r2 = await call(
			JSON.stringify({ sales: [sale(20_000, { pad: 'x'.repeat(5_000_000) })] })
		);
		expect(r2.status).toBe(413);
		expect(((await r2.json()) as { error: string }).error).toMatch(/MB/);
		const r3 = await call('{not json');
		expect(r3.status).toBe(400);
		const stored = await db
			.select({ id: s.boothSales.id })
			.from(s.boothSales)
			.where(eq(s.boothSales.id, sale(10_000).id));
		expect(stored).toHaveLength(0);
	});
});

describe('booth order', () => {
	it('lands in the orders with the deposit, once', async () => {
		const o = {
			id: `${tag}-order-1`,
			at: new Date().toISOString(),
			pieceSlug,
			woodSlug,
			initials: 'AB',
			name: 'Fair Buyer',
			email: `${tag}@example.test`,
			line1: '2 Lane',
			city: 'Linden Ford',
			postcode: '80302',
			country: 'US',
			depositMinor: 1000,
			method: 'cash' as const,
			delivery: 'collect' as const
		};
		const first = await placeBoothOrder(fairId, o, helper);
		expect(first.status).toBe('accepted');
		const second = await placeBoothOrder(fairId, o, helper);
		expect(second.status).toBe('duplicate');
		const rows = await db.select().from(s.orders).where(eq(s.orders.email, o.email));
		expect(rows).toHaveLength(1);
		expect(rows[0]).toMatchObject({
			depositMinor: 1000,
			status: 'deposit_held',
			totalMinor: 2145,
			giftNote: null
		});
	});
});

describe('tally, close and report', () => {
	it('refuses counts that are negative or not whole', () => {
		expect(countSchema.safeParse('-1').success).toBe(false);
		expect(countSchema.safeParse('1.5').success).toBe(false);
		expect(countSchema.safeParse('3').success).toBe(true);
	});

	it('closes once under two concurrent closes, returning what was counted', async () => {
		const t = await fairTally(fairId);
		await saveTally(
			fairId,
			{ counts: { [t.pieces[0].fairStockId]: 0 }, cashCountedMinor: 10_000 },
			helper
		);
		// Nothing left was counted back (the flagged sale emptied the box): nothing returns.
		const before = await qty('workshop');
		const results = await Promise.allSettled([
			closeFair(fairId, owner.id),
			closeFair(fairId, owner.id)
		]);
		expect(results.filter((r) => r.status === 'fulfilled')).toHaveLength(1);
		expect(results.filter((r) => r.status === 'rejected')).toHaveLength(1);
		expect(await qty('workshop')).toBe(before);
		expect(await qty(`fair:${fairId}`)).toBe(0);
		// Made after the close (a second later): refused with a reason; resends stay duplicates.
		const after = await syncSales(
			fairId,
			[sale(900, { at: new Date(Date.now() + 2000).toISOString() }), sale(1)],
			helper
		);
		expect(after.rejected.map((r) => r.id)).toEqual([sale(900).id]);
		expect(after.rejected[0].error).toMatch(/closed/);
		expect(after.duplicate).toEqual([sale(1).id]);
		await expect(saveTally(fairId, { counts: {} }, helper)).rejects.toThrow(/closed/);
	});

	it('writes a CSV that a general-purpose parser reads back to the report totals', async () => {
		const r = await fairReport(fairId);
		const csvText = fairCsv(r);
		const parsed = Papa.parse<Record<string, string>>(csvText, {
			header: true,
			skipEmptyLines: true
		});
		expect(parsed.errors).toEqual([]);
		const cents = (col: string, kind?: string) =>
			parsed.data
				.filter((row) => kind === undefined || row.kind === kind)
				.reduce((a, row) => a + Math.round(Number(row[col] || 0) * 100), 0);
		// Checked with papaparse (a general-purpose RFC 4180 CSV parser): the whole total column
		// sums to the takings (deposits and summary rows do not count twice).
		expect(cents('total')).toBe(r.result.takings);
		expect(cents('sales_tax')).toBe(r.result.taxDue);
		// The only deposit here was taken in cash.
		expect(cents('deposit', 'deposit')).toBe(r.result.cash.deposits);
		expect(csvText.charCodeAt(0)).toBe(0xfeff);
		const summary = (what: string) =>
			Math.round(
				Number(
					parsed.data.find((row) => row.kind === 'summary' && row.note === what)?.summary_amount
				) * 100
			);
		expect(summary('Takings')).toBe(r.result.takings);
		expect(summary('Net')).toBe(r.result.net);
		expect(parsed.data.filter((row) => row.kind === 'sale')).toHaveLength(
			r.entries.filter((e) => e.kind === 'sale').length
		);
	});

	it('writes the money report as a CSV that reads back to its totals', async () => {
		const r = await moneyReport();
		const parsed = Papa.parse<Record<string, string>>(moneyCsv(r), {
			header: true,
			skipEmptyLines: true
		});
		expect(parsed.errors).toEqual([]);
		const cents = (col: string) =>
			parsed.data.reduce((a, row) => a + Math.round(Number(row[col]) * 100), 0);
		// Checked with papaparse (a general-purpose RFC 4180 CSV parser).
		expect(cents('sales_before_tax')).toBe(r.totals.salesMinor);
		expect(cents('sales_tax')).toBe(r.totals.taxMinor);
		expect(cents('refunds')).toBe(r.totals.refundsMinor);
		expect(parsed.data.some((row) => row.channel === 'fair sales')).toBe(true);
	});
});

describe('packing checklist', () => {
	it('prints on A4 (210 × 297 mm) and US Letter (8.5 × 11 in)', async () => {
		const fair = { name: 'Test', place: 'Hall', startsOn: '2026-06-01', endsOn: '2026-06-01' };
		const lines = Array.from({ length: 40 }, (_, i) => ({
			title: `Piece ${i}`,
			woodName: 'Basswood',
			quantity: 2
		}));
		// ISO 216 A4 and ANSI Letter, at 72 pt per inch (ISO 32000-1 user space).
		for (const [paper, w, h] of [
			['a4', 595.28, 841.89],
			['letter', 612, 792]
		] as const) {
			const doc = await PDFDocument.load(await checklistPdf(fair, lines, paper));
			expect(doc.getPageCount()).toBeGreaterThan(1);
			const size = doc.getPage(0).getSize();
			expect(size.width).toBeCloseTo(w, 1);
			expect(size.height).toBeCloseTo(h, 1);
		}
	});
});
