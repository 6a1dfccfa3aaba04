import { and, desc, eq, gt, inArray } from 'drizzle-orm';
import type { TallyCounts } from '$lib/booth/tally-input';
import { db, type Db, type Tx } from '../db';
import { boothSales, fairs, fairStock, stock, tallies, tallyCounts } from '../db/schema';
import { transact } from '../db/retry';
import { adjustStock, fairPlace } from '../stock/adjust';
import { reconcile, tallyEntries } from '$lib/booth/reconcile';
import { countingDay, fairDays, wholeFairCounted } from '$lib/booth/cash-up';
import { isoDay, today as todayIso } from '$lib/locale/dates';
import { fairPieces, getFair, type Fair } from '../fairs/fairs';
import { DomainError } from '../errors/domain-error';

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
		.orderBy(desc(tallies.day))
		.limit(1);
	return t ?? null;
}

/** Every day's cash-up of a fair with its piece counts, by day. */
export async function dayTallies(fairId: number, conn: Db | Tx = db) {
	const rows = await conn.select().from(tallies).where(eq(tallies.fairId, fairId));
	const counts = rows.length
		? await conn
				.select()
				.from(tallyCounts)
				.where(
					inArray(
						tallyCounts.tallyId,
						rows.map((r) => r.id)
					)
				)
		: [];
	return new Map(
		rows.map((r) => [
			r.day,
			{
				...r,
				pieces: new Map(
					counts.filter((c) => c.tallyId === r.id).map((c) => [c.fairStockId, c.counted])
				)
			}
		])
	);
}
export type DayTally = NonNullable<ReturnType<Awaited<ReturnType<typeof dayTallies>>['get']>>;

/**
 * Everything the tally page and the report need, worked out by `reconcile`: the whole fair, and
 * each day's cash-up (that day's entries against the float, pieces expected after that day).
 */
export async function fairTally(fairId: number, conn: Db | Tx = db) {
	const fair = await getFair(fairId, conn);
	const [pieces, entries, byDay, tally] = await Promise.all([
		fairPieces(fairId, conn),
		boothEntries(fairId, conn),
		dayTallies(fairId, conn),
		latestTally(fairId, conn)
	]);
	const days = fairDays(fair.startsOn, fair.endsOn);
	// An entry dated outside the fair's days is counted in its nearest day's tin.
	const dayOfEntry = (e: BoothEntry) => countingDay(days, isoDay(e.soldAt));
	const soldOf = (pieceId: number, woodId: number, upTo?: string) =>
		entries
			.filter((e) => !e.voidedAt && (!upTo || dayOfEntry(e) <= upTo))
			.flatMap((e) => e.lines)
			.filter((l) => l.pieceId === pieceId && l.woodId === woodId)
			.reduce((a, l) => a + l.quantity, 0);
	const run = (
		of: BoothEntry[],
		cash: { paidOut: number; counted: number | null; card: number | null },
		counted: (fairStockId: number, fallback: number | null) => number | null,
		upTo?: string
	) =>
		reconcile({
			floatMinor: fair.cashFloatMinor,
			cashPaidOutMinor: cash.paidOut,
			cashCountedMinor: cash.counted,
			cardReportedMinor: cash.card,
			cardFeeBp: fair.cardFeeBp,
			boothFeeMinor: fair.boothFeeMinor,
			otherCostsMinor: fair.otherCostsMinor,
			entries: tallyEntries(of),
			stock: pieces.map((p) => ({
				key: String(p.fairStockId),
				label: `${p.title} · ${p.woodName}`,
				loadedOut: p.loadedOut,
				sold: soldOf(p.pieceId, p.woodId, upTo),
				counted: counted(p.fairStockId, p.countedBack)
			}))
		});
	const perDay = days.map((day) => {
		const t = byDay.get(day) ?? null;
		const result = run(
			entries.filter((e) => dayOfEntry(e) === day),
			{
				paidOut: t?.cashPaidOutMinor ?? 0,
				counted: t?.cashCountedMinor ?? null,
				card: t?.cardReportedMinor ?? null
			},
			(id) => t?.pieces.get(id) ?? null,
			day
		);
		return { day, tally: t, result };
	});
	// The whole fair: one tin whose takings were lifted out each day, so its gap is the days' gaps.
	const paidOut = perDay.reduce((a, d) => a + (d.tally?.cashPaidOutMinor ?? 0), 0);
	const cards = perDay.map((d) => d.tally?.cardReportedMinor ?? null).filter((c) => c !== null);
	const card = cards.length ? cards.reduce((a, c) => a + c, 0) : null;
	const open = run(entries, { paidOut, counted: null, card }, (_, back) => back);
	const result = run(
		entries,
		{
			paidOut,
			counted: wholeFairCounted(
				open.cash.expected,
				perDay.map((d) => d.result.cash.difference)
			),
			card
		},
		(_, back) => back
	);
	return {
		fair,
		pieces,
		entries,
		tally,
		days: perDay,
		result,
		flaggedSales: entries.filter((e) => e.flagged && !e.voidedAt).length,
		lateSales: entries.filter((e) => e.late && !e.voidedAt).length
	};
}

/**
 * Saves one day's cash-up (pieces, cash, and the reader's total when the owner gives it). A
 * helper counts a day at most twice (the count and one recount); the owner may always correct.
 */
export async function saveTally(
	fairId: number,
	c: TallyCounts,
	user: { id: string; role: string }
): Promise<{ status: 'saved' | 'duplicate'; day: string }> {
	return transact(async (tx) => {
		const [fair] = await tx.select().from(fairs).where(eq(fairs.id, fairId)).for('update');
		if (!fair) throw new DomainError(404, 'There is no such fair.');
		if (fair.closedAt)
			throw new DomainError(409, 'This fair is closed; its tally can no longer change.');
		const days = fairDays(fair.startsOn, fair.endsOn);
		const day = c.day ?? countingDay(days, todayIso());
		if (!days.includes(day)) throw new DomainError(400, 'That day is not one of the fair’s days.');
		const [prev] = await tx
			.select()
			.from(tallies)
			.where(and(eq(tallies.fairId, fairId), eq(tallies.day, day)))
			.for('update');
		if (prev && c.saveId && prev.lastSaveId === c.saveId) return { status: 'duplicate', day };
		if (prev && user.role !== 'owner' && prev.counts >= 2)
			throw new DomainError(
				409,
				'This day was counted and counted again; the owner can correct it now.'
			);
		const lines = await tx
			.select({ id: fairStock.id })
			.from(fairStock)
			.where(eq(fairStock.fairId, fairId));
		const ids = new Set(lines.map((l) => l.id));
		for (const id of Object.keys(c.counts))
			if (!ids.has(Number(id)))
				throw new DomainError(400, 'A counted piece is not on this fair’s load-out.');
		const values = {
			cashCountedMinor: c.cashCountedMinor ?? prev?.cashCountedMinor ?? null,
			cashPaidOutMinor: c.cashPaidOutMinor ?? prev?.cashPaidOutMinor ?? 0,
			cardReportedMinor:
				c.cardReportedMinor === undefined ? (prev?.cardReportedMinor ?? null) : c.cardReportedMinor,
			createdBy: user.id,
			lastSaveId: c.saveId ?? null
		};
		let tallyId: number;
		if (prev) {
			tallyId = prev.id;
			await tx
				.update(tallies)
				.set({
					...values,
					counts: prev.counts + 1,
					// Keep what was counted first, so a recount never hides the first figure.
					firstCashCountedMinor: prev.firstCashCountedMinor ?? prev.cashCountedMinor
				})
				.where(eq(tallies.id, prev.id));
		} else {
			[{ id: tallyId }] = await tx
				.insert(tallies)
				.values({ ...values, fairId, day, createdAt: new Date() })
				.$returningId();
		}
		const later = await tx
			.select({ day: tallies.day })
			.from(tallies)
			.where(and(eq(tallies.fairId, fairId), gt(tallies.day, day)));
		for (const [id, n] of Object.entries(c.counts)) {
			await tx
				.insert(tallyCounts)
				.values({ tallyId, fairStockId: Number(id), counted: n })
				.onDuplicateKeyUpdate({ set: { counted: n } });
			// The latest day's count is what goes back to the workshop at the close.
			if (later.length === 0)
				await tx
					.update(fairStock)
					.set({ countedBack: n })
					.where(eq(fairStock.id, Number(id)));
		}
		return { status: 'saved', day };
	});
}

/**
 * Closes a fair once: the pieces counted back (or, where nobody counted, what the fair's stock
 * shows) go back to the workshop shelf; any gap is written off on the fair with its reason, so
 * the fair's stock ends at zero. A second close finds `closed_at` set under the lock and stops.
 */
export async function closeFair(fairId: number, userId: string): Promise<Fair> {
	return transact(async (tx) => {
		const [fair] = await tx.select().from(fairs).where(eq(fairs.id, fairId)).for('update');
		if (!fair) throw new DomainError(404, 'There is no such fair.');
		if (fair.closedAt)
			throw new DomainError(409, 'This fair is already closed; its pieces went back then.');
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
					reason: gap > 0 ? `Missing at the ${fair.name} tally` : `Found at the ${fair.name} tally`
				});
			}
			await tx.update(fairStock).set({ returned: back }).where(eq(fairStock.id, l.id));
		}
		const closedAt = new Date();
		await tx.update(fairs).set({ closedAt }).where(eq(fairs.id, fairId));
		return { ...fair, closedAt };
	});
}
