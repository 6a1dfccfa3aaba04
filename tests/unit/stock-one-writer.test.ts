/**
 * `src/lib/server/stock/` is the one writer of the stock tables (`stock`, `stock_adjustments`):
 * every change is locked, refused below zero and logged there (`adjustStock`). And stock sits
 * below fairs and the booth: it imports nothing of theirs (the fair-open check is handed in).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { importGraph, LIB, rel, sourceFiles, SRC } from '../helpers/source-scan';

const STOCK = `${LIB}/server/stock/`;
const TABLES = ['stock', 'stockAdjustments'];
const SQL_TABLES = ['stock', 'stock_adjustments'];

/** The places in a file's text that write a stock table (Drizzle or raw SQL). */
function stockWrites(text: string): string[] {
	// Names the tables are imported under, aliases too (`stock as shelf`).
	const names = new Set(TABLES);
	for (const m of text.matchAll(/\b(stock|stockAdjustments)\s+as\s+(\w+)/g)) names.add(m[2]);
	const drizzle = new RegExp(
		`\\.(insert|update|delete)\\(\\s*(?:\\w+\\.)?(${[...names].join('|')})\\s*\\)`,
		'g'
	);
	const sql = new RegExp(
		`\\b(insert\\s+into|update|delete\\s+from)\\s+\`?(${SQL_TABLES.join('|')})\\b`,
		'gi'
	);
	return [...text.matchAll(drizzle), ...text.matchAll(sql)].map((m) => m[0]);
}

describe('stock has one writer', () => {
	const files = sourceFiles(SRC);

	it('the scan sees a write in each form it looks for', () => {
		expect(stockWrites('await tx.insert(stockAdjustments).values(x)')).toHaveLength(1);
		expect(stockWrites('await tx\n\t.update( schema.stock )\n\t.set({})')).toHaveLength(1);
		expect(
			stockWrites("import { stock as shelf } from '../db/schema'; db.delete(shelf)")
		).toHaveLength(1);
		expect(stockWrites('sql`update stock set quantity = 0`')).toHaveLength(1);
		expect(stockWrites('sql`DELETE FROM `stock_adjustments``')).toHaveLength(1);
		// Reading is not writing; nor is another table whose name starts the same.
		expect(
			stockWrites('tx.select().from(stock); tx.update(stockCounts); tx.insert(fairStock)')
		).toEqual([]);
		// And the one writer is found where it is.
		const adjust = readFileSync(`${STOCK}adjust.ts`, 'utf8');
		expect(stockWrites(adjust).length).toBeGreaterThanOrEqual(3);
	});

	it('no file outside src/lib/server/stock/ inserts, updates or deletes stock rows', () => {
		const outside = files
			.filter((f) => !f.startsWith(STOCK))
			.flatMap((f) => stockWrites(readFileSync(f, 'utf8')).map((w) => `${rel(f)}: ${w}`));
		expect(outside).toEqual([]);
	});

	it('stock/ imports nothing from fairs or the booth', () => {
		const graph = importGraph(files.filter((f) => f.startsWith(STOCK)));
		expect(graph.size).toBeGreaterThan(0);
		const upward = /\/src\/lib\/(server\/)?(fairs|booth)\//;
		const offenders = [...graph].flatMap(([f, to]) =>
			to.filter((t) => upward.test(t)).map((t) => `${rel(f)} → ${rel(t)}`)
		);
		expect(offenders).toEqual([]);
	});
});
