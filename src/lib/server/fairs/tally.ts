import { and, desc, eq } from 'drizzle-orm';
import { db, type Db, type Tx } from '../db';
import { boothSales, fairs, fairStock, stock, tallies } from '../db/schema';
import { withRetry } from '../db/retry';
import { adjustStock, fairPlace } from '../stock/adjust';
import { reconcile, tallyEntries } from '$lib/reconcile';
import { fairPieces, getFair, type Fair } from './fairs';
import { FairError } from './errors';

export async function boothEntries(fairId: number, conn: Db | Tx = db) {
	return conn
		.select()
		.from(boothSales)
		.where(eq(boothSales.fairId, fairId))
		.orderBy(boothSales.soldAt);
}
export type BoothEntry = Awaited<ReturnType<typeof boothEntries>>[number];

export async function latestTally(fairId: number, conn: Db | Tx = db) {
	const [t] = await conn
		.select()
		.from(tallies)
		.where(eq(tallies.fairId, fairId))
		.orderBy(desc(tallies.id))
		.limit(1);
	return t ?? null;
}

/** Everything the tally page and the report need, worked out by `reconcile`. */
export async function fairTally(fairId: number, conn: Db | Tx = db) {
	const fair = await getFair(fairId, conn);
	const [pieces, entries, tally] = await Promise.all([
		fairPieces(fairId, conn),
		boothEntries(fairId, conn),
		latestTally(fairId, conn)
	]);
	const soldOf = (pieceId: number, woodId: number) =>
		entries
			.filter((e) => !e.voidedAt)
			.flatMap((e) => e.lines)
			.filter((l) => l.pieceId === pieceId && l.woodId === woodId)
			.reduce((a, l) => a + l.quantity, 0);
	const result = reconcile({
		floatMinor: fair.cashFloatMinor,
		cashPaidOutMinor: tally?.cashPaidOutMinor ?? 0,
		cashCountedMinor: tally?.cashCountedMinor ?? null,
		cardReportedMinor: tally?.cardReportedMinor ?? null,
		cardFeeBp: fair.cardFeeBp,
		boothFeeMinor: fair.boothFeeMinor,
		otherCostsMinor: fair.otherCostsMinor,
		entries: tallyEntries(entries),
		stock: pieces.map((p) => ({
			key: String(p.fairStockId),
			label: `${p.title} · ${p.woodName}`,
			loadedOut: p.loadedOut,
			sold: soldOf(p.pieceId, p.woodId),
			counted: p.countedBack
		}))
	});
	return {
		fair,
		pieces,
		entries,
		tally,
		result,
		flaggedSales: entries.filter((e) => e.flagged && !e.voidedAt).length,
		lateSales: entries.filter((e) => e.late && !e.voidedAt).length
	};
}

export type TallyCounts = {
	counts: Record<number, number>;
	cashCountedMinor?: number;
	cashPaidOutMinor?: number;
	cardReportedMinor?: number | null;
};

/** Saves the counts (pieces, cash, and the reader's total when the owner gives it). */
export async function saveTally(fairId: number, c: TallyCounts, userId: string) {
	await withRetry(() =>
		db.transaction(async (tx) => {
			const [fair] = await tx.select().from(fairs).where(eq(fairs.id, fairId)).for('update');
			if (!fair) throw new FairError('There is no such fair.', 404);
			if (fair.closedAt)
				throw new FairError('This fair is closed; its tally can no longer change.', 409);
			const lines = await tx
				.select({ id: fairStock.id })
				.from(fairStock)
				.where(eq(fairStock.fairId, fairId));
			const ids = new Set(lines.map((l) => l.id));
			for (const [id, n] of Object.entries(c.counts)) {
				if (!ids.has(Number(id)))
					throw new FairError('A counted piece is not on this fair’s load-out.');
				await tx
					.update(fairStock)
					.set({ countedBack: n })
					.where(eq(fairStock.id, Number(id)));
			}
			const prev = await latestTally(fairId, tx);
			const values = {
				cashCountedMinor: c.cashCountedMinor ?? prev?.cashCountedMinor ?? null,
				cashPaidOutMinor: c.cashPaidOutMinor ?? prev?.cashPaidOutMinor ?? 0,
				cardReportedMinor:
					c.cardReportedMinor === undefined
						? (prev?.cardReportedMinor ?? null)
						: c.cardReportedMinor,
				createdBy: userId
			};
			if (prev) await tx.update(tallies).set(values).where(eq(tallies.id, prev.id));
			else
				await tx
					.insert(tallies)
					.values({ ...values, fairId, day: fair.endsOn, createdAt: new Date() });
		})
	);
}

/**
 * Closes a fair once: the pieces counted back (or, where nobody counted, what the fair's stock
 * shows) go back to the workshop shelf; any gap is written off on the fair with its reason, so
 * the fair's stock ends at zero. A second close finds `closed_at` set under the lock and stops.
 */
export async function closeFair(fairId: number, userId: string): Promise<Fair> {
	return withRetry(() =>
		db.transaction(async (tx) => {
			const [fair] = await tx.select().from(fairs).where(eq(fairs.id, fairId)).for('update');
			if (!fair) throw new FairError('There is no such fair.', 404);
			if (fair.closedAt)
				throw new FairError('This fair is already closed; its pieces went back then.', 409);
			const lines = await tx
				.select()
				.from(fairStock)
				.where(eq(fairStock.fairId, fairId))
				.orderBy(fairStock.pieceId, fairStock.woodId);
			const place = fairPlace(fairId);
			for (const l of lines) {
				const [row] = await tx
					.select({ quantity: stock.quantity })
					.from(stock)
					.where(
						and(eq(stock.pieceId, l.pieceId), eq(stock.woodId, l.woodId), eq(stock.place, place))
					);
				const onHand = row?.quantity ?? 0;
				const back = Math.max(l.countedBack ?? onHand, 0);
				const base = { pieceId: l.pieceId, woodId: l.woodId, userId, allowNegative: true };
				if (back > 0) {
					await adjustStock(tx, { ...base, place, delta: -back, reason: `Back from ${fair.name}` });
					await adjustStock(tx, {
						...base,
						place: 'workshop',
						delta: back,
						reason: `Back from ${fair.name}`
					});
				}
				const gap = onHand - back;
				if (gap !== 0) {
					await adjustStock(tx, {
						...base,
						place,
						delta: -gap,
						reason:
							gap > 0 ? `Missing at the ${fair.name} tally` : `Found at the ${fair.name} tally`
					});
				}
				await tx.update(fairStock).set({ returned: back }).where(eq(fairStock.id, l.id));
			}
			const closedAt = new Date();
			await tx.update(fairs).set({ closedAt }).where(eq(fairs.id, fairId));
			return { ...fair, closedAt };
		})
	);
}
