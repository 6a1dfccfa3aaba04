/**
 * One piece's stock as the owner sees it on the piece page: counts per wood × place (the
 * workshop shelf and each fair), the history of every change with who made it and why, and the
 * owner's own changes, which go through `adjustStock` like every other stock move.
 */
import { and, desc, eq, inArray, isNull } from 'drizzle-orm';
import { db, type Tx } from '../db';
import { transact } from '../db/retry';
import {
	fairs,
	pieces,
	pieceWoods,
	stock,
	stockAdjustments,
	users,
	woods,
	WORKSHOP
} from '../db/schema';
import { adjustStock, type StockPlace } from './adjust';
import { DomainError, isDomainError } from '../errors/domain-error';

/** A change the owner asked for that cannot be made, with the field its message goes beside. */
function refused(status: 400 | 404 | 409, message: string, field?: 'woodId' | 'place' | 'count') {
	return new DomainError(status, message, field ? { fields: { [field]: [message] } } : {});
}

const fairIdOf = (place: string) => (place.startsWith('fair:') ? Number(place.slice(5)) : null);

/** Names for places: "Workshop shelf", or the fair's name. */
async function placeNames(places: string[]) {
	const ids = places.map(fairIdOf).filter((n): n is number => n !== null);
	const rows = ids.length
		? await db
				.select({ id: fairs.id, name: fairs.name, closedAt: fairs.closedAt })
				.from(fairs)
				.where(inArray(fairs.id, ids))
		: [];
	return (place: string) => {
		const id = fairIdOf(place);
		if (id === null) return 'Workshop shelf';
		return rows.find((r) => r.id === id)?.name ?? `Fair ${id} (gone)`;
	};
}

export async function pieceStock(pieceId: number, historyLimit = 100) {
	const [offered, rows, openFairs, history] = await Promise.all([
		db
			.select({ id: woods.id, name: woods.name })
			.from(pieceWoods)
			.innerJoin(woods, eq(woods.id, pieceWoods.woodId))
			.where(eq(pieceWoods.pieceId, pieceId)),
		db
			.select({
				woodId: stock.woodId,
				woodName: woods.name,
				place: stock.place,
				quantity: stock.quantity
			})
			.from(stock)
			.innerJoin(woods, eq(woods.id, stock.woodId))
			.where(eq(stock.pieceId, pieceId)),
		db
			.select({ id: fairs.id, name: fairs.name, startsOn: fairs.startsOn })
			.from(fairs)
			.where(isNull(fairs.closedAt))
			.orderBy(fairs.startsOn),
		db
			.select({
				id: stockAdjustments.id,
				woodName: woods.name,
				place: stockAdjustments.place,
				delta: stockAdjustments.delta,
				reason: stockAdjustments.reason,
				by: users.name,
				at: stockAdjustments.createdAt
			})
			.from(stockAdjustments)
			.innerJoin(woods, eq(woods.id, stockAdjustments.woodId))
			.leftJoin(users, eq(users.id, stockAdjustments.userId))
			.where(eq(stockAdjustments.pieceId, pieceId))
			.orderBy(desc(stockAdjustments.createdAt), desc(stockAdjustments.id))
			.limit(historyLimit)
	]);
	// Woods still offered first, then any wood that has stock but is no longer offered.
	const woodList = [...offered];
	for (const r of rows)
		if (!woodList.some((w) => w.id === r.woodId)) woodList.push({ id: r.woodId, name: r.woodName });
	// The shelf, every open fair, then fairs that still hold (or held) some of this piece.
	const placeKeys = [WORKSHOP, ...openFairs.map((f) => `fair:${f.id}`)];
	for (const r of rows) if (!placeKeys.includes(r.place)) placeKeys.push(r.place);
	const nameOf = await placeNames([...placeKeys, ...history.map((h) => h.place)]);
	const open = new Set([WORKSHOP, ...openFairs.map((f) => `fair:${f.id}`)]);
	return {
		woods: woodList,
		places: placeKeys.map((key) => ({ key, name: nameOf(key), adjustable: open.has(key) })),
		counts: rows.map((r) => ({ woodId: r.woodId, place: r.place, quantity: r.quantity })),
		history: history.map((h) => ({ ...h, placeName: nameOf(h.place), by: h.by ?? 'the shop' }))
	};
}
export type PieceStock = Awaited<ReturnType<typeof pieceStock>>;

/**
 * The fair behind a `fair:<id>` place, read in the caller's transaction and held there so it
 * cannot close under the change; null when there is no such fair. Handed in by the caller, since
 * fairs own that rule and stock never imports them.
 */
export type FairForStock = (
	tx: Tx,
	fairId: number
) => Promise<{ name: string; closedAt: Date | null } | null>;

/**
 * The owner adds or takes away pieces of one wood at one place, with a reason. The piece must
 * exist, offer that wood (or already hold stock of it, so old stock can be cleared) and the place
 * must be the shelf or a fair that is not closed. The stock row is locked by `adjustStock`, so
 * concurrent changes queue up and the count never goes below zero.
 */
export async function adjustPieceStock(
	pieceId: number,
	change: { woodId: number; place: StockPlace; delta: number; reason: string },
	userId: string,
	fairForStock: FairForStock
) {
	return transact(async (tx) => {
		const [piece] = await tx
			.select({ id: pieces.id, title: pieces.title })
			.from(pieces)
			.where(eq(pieces.id, pieceId));
		if (!piece) throw refused(404, 'There is no such piece.');
		const [wood] = await tx
			.select({ name: woods.name })
			.from(woods)
			.where(eq(woods.id, change.woodId));
		const [offered] = await tx
			.select({ n: pieceWoods.woodId })
			.from(pieceWoods)
			.where(and(eq(pieceWoods.pieceId, pieceId), eq(pieceWoods.woodId, change.woodId)));
		const [held] = offered
			? [offered]
			: await tx
					.select({ n: stock.id })
					.from(stock)
					.where(and(eq(stock.pieceId, pieceId), eq(stock.woodId, change.woodId)))
					.limit(1);
		if (!wood || !held) throw refused(400, `${piece.title} is not made in that wood.`, 'woodId');
		const fairId = fairIdOf(change.place);
		let placeName = 'the workshop';
		if (fairId !== null) {
			const fair = await fairForStock(tx, fairId);
			if (!fair) throw refused(400, 'There is no such fair.', 'place');
			if (fair.closedAt)
				throw refused(
					409,
					`${fair.name} is closed; its pieces went back to the workshop.`,
					'place'
				);
			placeName = fair.name;
		}
		try {
			return await adjustStock(tx, { pieceId, ...change, userId });
		} catch (err) {
			if (isDomainError(err, 'short')) {
				throw refused(
					409,
					`Only ${Math.max(err.count ?? 0, 0)} ${piece.title} in ${wood.name} at ${placeName}: you cannot take away ${-change.delta}. Nothing was changed.`,
					'count'
				);
			}
			throw err;
		}
	});
}
