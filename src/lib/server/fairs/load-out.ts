import { and, asc, eq, gt } from 'drizzle-orm';
import { db } from '../db';
import { fairs, fairStock, pieces, stock, woods } from '../db/schema';
import { transact } from '../db/retry';
import { adjustStock, fairPlace } from '../stock/adjust';
import { DomainError, isDomainError } from '../errors/domain-error';

/** Finished pieces on the workshop shelf that could go to a fair. */
export async function workshopShelf() {
	return db
		.select({
			pieceId: pieces.id,
			woodId: woods.id,
			title: pieces.title,
			woodName: woods.name,
			quantity: stock.quantity
		})
		.from(stock)
		.innerJoin(pieces, eq(pieces.id, stock.pieceId))
		.innerJoin(woods, eq(woods.id, stock.woodId))
		.where(and(eq(stock.place, 'workshop'), gt(stock.quantity, 0)))
		.orderBy(asc(pieces.title), asc(woods.name));
}

/**
 * Moves pieces from the workshop shelf to a fair: two stock adjustments per line (out of the
 * workshop, into the fair) and the fair's load-out count, all in one transaction. Refuses the
 * whole load-out when any line asks for more than the shelf holds.
 */
export async function loadOut(
	fairId: number,
	lines: { pieceId: number; woodId: number; quantity: number }[],
	userId: string
) {
	if (lines.length === 0) throw new DomainError(400, 'Choose at least one piece to take.');
	await transact(async (tx) => {
		const [fair] = await tx.select().from(fairs).where(eq(fairs.id, fairId)).for('update');
		if (!fair) throw new DomainError(404, 'There is no such fair.');
		if (fair.closedAt)
			throw new DomainError(409, 'This fair is closed; nothing more can be loaded out.');
		// Lock in a fixed order so two load-outs at once cannot deadlock each other.
		const sorted = [...lines].sort((a, b) => a.pieceId - b.pieceId || a.woodId - b.woodId);
		for (const l of sorted) {
			const reason = `Loaded out to ${fair.name}`.slice(0, 160);
			try {
				await adjustStock(tx, { ...l, place: 'workshop', delta: -l.quantity, reason, userId });
			} catch (err) {
				if (isDomainError(err, 'short')) {
					throw new DomainError(409, `Not enough on the workshop shelf: ${err.message}`);
				}
				throw err;
			}
			await adjustStock(tx, {
				...l,
				place: fairPlace(fairId),
				delta: l.quantity,
				reason,
				userId
			});
			const [line] = await tx
				.select({ id: fairStock.id, loadedOut: fairStock.loadedOut })
				.from(fairStock)
				.where(
					and(
						eq(fairStock.fairId, fairId),
						eq(fairStock.pieceId, l.pieceId),
						eq(fairStock.woodId, l.woodId)
					)
				)
				.for('update');
			if (line) {
				await tx
					.update(fairStock)
					.set({ loadedOut: line.loadedOut + l.quantity })
					.where(eq(fairStock.id, line.id));
			} else {
				await tx
					.insert(fairStock)
					.values({ fairId, pieceId: l.pieceId, woodId: l.woodId, loadedOut: l.quantity });
			}
		}
	});
}
