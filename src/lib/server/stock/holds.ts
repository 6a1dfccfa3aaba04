/**
 * Stock holds: a checkout takes finished pieces off the workshop shelf while the buyer pays;
 * cancelling, expiry or the sweep puts them back (`$lib/server/orders/holds`). Every change goes
 * through `adjustStock`, after the shelf rows are locked in id order, so two transactions never
 * wait on each other in a circle.
 */
import { and, eq, inArray } from 'drizzle-orm';
import { db, type Tx } from '../db';
import { stock, WORKSHOP } from '../db/schema';
import { adjustStock } from './adjust';

export type Want = { pieceId: number; woodId: number; quantity: number };

/** Finished pieces on the workshop shelf for one piece in one wood. */
export async function stockOnHand(pieceId: number, woodId: number) {
	const [row] = await db
		.select({ quantity: stock.quantity })
		.from(stock)
		.where(and(eq(stock.pieceId, pieceId), eq(stock.woodId, woodId), eq(stock.place, WORKSHOP)));
	return row?.quantity ?? 0;
}

async function lockShelf(tx: Tx, wants: Want[]) {
	if (wants.length === 0) return [];
	return tx
		.select({
			id: stock.id,
			pieceId: stock.pieceId,
			woodId: stock.woodId,
			quantity: stock.quantity
		})
		.from(stock)
		.where(
			and(
				eq(stock.place, WORKSHOP),
				inArray(
					stock.pieceId,
					wants.map((w) => w.pieceId)
				)
			)
		)
		.orderBy(stock.id)
		.for('update');
}

/** Each wanted line through `adjustStock` (its own adjustment row), in one fixed order. */
async function adjustShelf(tx: Tx, wants: Want[], sign: 1 | -1, reason: string) {
	const ordered = [...wants].sort((a, b) => a.pieceId - b.pieceId || a.woodId - b.woodId);
	for (const w of ordered) {
		if (w.quantity === 0) continue;
		await adjustStock(tx, {
			pieceId: w.pieceId,
			woodId: w.woodId,
			place: WORKSHOP,
			delta: sign * w.quantity,
			reason
		});
	}
}

/**
 * Takes every wanted piece off the shelf, or none: returns the first line that is short (and
 * changes nothing) when the shelf cannot cover them all. Never takes stock below zero. `reason`
 * goes on the adjustment rows (which order took them).
 */
export async function takeStock(tx: Tx, wants: Want[], reason: string): Promise<Want | null> {
	const rows = await lockShelf(tx, wants);
	const need = new Map<number, number>();
	for (const w of wants) {
		const row = rows.find((r) => r.pieceId === w.pieceId && r.woodId === w.woodId);
		const total = (row ? (need.get(row.id) ?? 0) : 0) + w.quantity;
		if (!row || row.quantity < total) return w;
		need.set(row.id, total);
	}
	await adjustShelf(tx, wants, -1, reason);
	return null;
}

/** Puts pieces back on the shelf (`adjustStock` makes the row if the owner deleted it meanwhile). */
export async function putBackStock(tx: Tx, wants: Want[], reason: string) {
	await lockShelf(tx, wants);
	await adjustShelf(tx, wants, 1, reason);
}
