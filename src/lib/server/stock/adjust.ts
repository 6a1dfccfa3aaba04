import { and, eq, sql } from 'drizzle-orm';
import type { Tx } from '../db';
import { stock, stockAdjustments } from '../db/schema';
import { DomainError } from '../errors/domain-error';

export type StockPlace = 'workshop' | `fair:${number}`;

export const fairPlace = (fairId: number): StockPlace => `fair:${fairId}`;

export type Adjustment = {
	pieceId: number;
	woodId: number;
	place: StockPlace;
	delta: number;
	reason: string;
	userId?: string | null;
	/**
	 * Only for a booth sale: the piece is already in the buyer's hands, so the sale is stored even
	 * when the count shows fewer; the shortfall is flagged for the tally instead of refused.
	 */
	allowNegative?: boolean;
};

/**
 * The one way stock changes: locks the stock row (creating it at zero when missing), refuses to
 * go below zero unless `allowNegative`, and writes the adjustment row beside it, in the caller's
 * transaction. Returns the new quantity and whether it went below zero.
 */
export async function adjustStock(tx: Tx, a: Adjustment) {
	if (!Number.isInteger(a.delta) || a.delta === 0)
		throw new Error('Stock change must be a whole, non-zero number');
	const where = and(
		eq(stock.pieceId, a.pieceId),
		eq(stock.woodId, a.woodId),
		eq(stock.place, a.place)
	);
	// Insert-if-missing first so there is always a row to lock; a no-op when it exists.
	await tx
		.insert(stock)
		.values({ pieceId: a.pieceId, woodId: a.woodId, place: a.place, quantity: 0 })
		.onDuplicateKeyUpdate({ set: { quantity: sql`${stock.quantity}` } });
	const [row] = await tx
		.select({ id: stock.id, quantity: stock.quantity })
		.from(stock)
		.where(where)
		.for('update');
	const next = row.quantity + a.delta;
	if (next < 0 && !a.allowNegative) {
		throw new DomainError(
			409,
			`Only ${Math.max(row.quantity, 0)} on hand at ${a.place}; cannot take ${-a.delta}.`,
			{ code: 'short', count: row.quantity }
		);
	}
	await tx.update(stock).set({ quantity: next }).where(eq(stock.id, row.id));
	await tx.insert(stockAdjustments).values({
		pieceId: a.pieceId,
		woodId: a.woodId,
		place: a.place,
		delta: a.delta,
		reason: a.reason.slice(0, 160),
		userId: a.userId ?? null,
		createdAt: new Date()
	});
	return { quantity: next, belowZero: next < 0 };
}
