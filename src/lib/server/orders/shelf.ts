import { and, eq, sql } from 'drizzle-orm';
import type { Tx } from '../db';
import { stock } from '../db/schema';

const WORKSHOP = 'workshop';

/** Puts finished pieces back on the workshop shelf (row locked; created when missing). */
export async function putBackOnShelf(tx: Tx, pieceId: number, woodId: number, qty: number) {
	const [row] = await tx
		.select({ id: stock.id })
		.from(stock)
		.where(and(eq(stock.pieceId, pieceId), eq(stock.woodId, woodId), eq(stock.place, WORKSHOP)))
		.for('update');
	if (row) {
		await tx
			.update(stock)
			.set({ quantity: sql`${stock.quantity} + ${qty}` })
			.where(eq(stock.id, row.id));
	} else {
		await tx.insert(stock).values({ pieceId, woodId, place: WORKSHOP, quantity: qty });
	}
}
