import { today as todayIso } from '$lib/locale/dates';
import { shopCurrency } from '$lib/locale/money';
import { and, asc, desc, eq, gte, sql } from 'drizzle-orm';
import { db, type Db, type Tx } from '../db';
import { fairs, fairStock, pieces, stock, woods } from '../db/schema';
import type { FairForm } from '$lib/fairs/schemas';
import { fairPlace } from '../stock/adjust';
import { replanQueue } from '../queue/carving-queue';
import { DomainError } from '../errors/domain-error';

export type Fair = typeof fairs.$inferSelect;

export async function getFair(id: number, conn: Db | Tx = db): Promise<Fair> {
	if (!Number.isInteger(id) || id <= 0) throw new DomainError(404, 'There is no such fair.');
	const [fair] = await conn.select().from(fairs).where(eq(fairs.id, id));
	if (!fair) throw new DomainError(404, 'There is no such fair.');
	return fair;
}

export function fairValues(f: FairForm) {
	return {
		name: f.name,
		place: f.place,
		startsOn: f.startsOn,
		endsOn: f.endsOn,
		boothFeeMinor: f.boothFee,
		otherCostsMinor: f.otherCosts,
		salesTaxBp: f.salesTax,
		pricesIncludeTax: f.pricesIncludeTax,
		cashFloatMinor: f.cashFloat,
		cardFeeBp: f.cardFee,
		helperDiscountBp: f.helperDiscount,
		openMinutes: f.openHours,
		notes: f.notes || null
	};
}

export async function createFair(f: FairForm): Promise<number> {
	const [{ id }] = await db
		.insert(fairs)
		.values({ ...fairValues(f), currency: shopCurrency() })
		.$returningId();
	// Fair days are days off for the carving queue.
	await replanQueue();
	return id;
}

export async function updateFair(id: number, f: FairForm) {
	const fair = await getFair(id);
	if (fair.closedAt)
		throw new DomainError(409, 'This fair is closed; its figures can no longer change.');
	await db.update(fairs).set(fairValues(f)).where(eq(fairs.id, id));
	if (fair.startsOn !== f.startsOn || fair.endsOn !== f.endsOn) await replanQueue();
}

export async function listFairs() {
	return db.select().from(fairs).orderBy(desc(fairs.startsOn));
}

/** Coming and running fairs for the public page: name, place and dates only. */
export async function comingFairs(today = todayIso()) {
	return db
		.select({
			id: fairs.id,
			name: fairs.name,
			place: fairs.place,
			startsOn: fairs.startsOn,
			endsOn: fairs.endsOn
		})
		.from(fairs)
		.where(gte(fairs.endsOn, today))
		.orderBy(asc(fairs.startsOn));
}

/** The pieces loaded out to a fair with their price and what the fair's stock shows now. */
export async function fairPieces(fairId: number, conn: Db | Tx = db) {
	const rows = await conn
		.select({
			fairStockId: fairStock.id,
			pieceId: pieces.id,
			woodId: woods.id,
			pieceSlug: pieces.slug,
			woodSlug: woods.slug,
			title: pieces.title,
			woodName: woods.name,
			personalisable: pieces.personalisable,
			basePriceMinor: pieces.basePriceMinor,
			priceAddOnMinor: woods.priceAddOnMinor,
			loadedOut: fairStock.loadedOut,
			countedBack: fairStock.countedBack,
			returned: fairStock.returned,
			onHand: stock.quantity
		})
		.from(fairStock)
		.innerJoin(pieces, eq(pieces.id, fairStock.pieceId))
		.innerJoin(woods, eq(woods.id, fairStock.woodId))
		.leftJoin(
			stock,
			and(
				eq(stock.pieceId, fairStock.pieceId),
				eq(stock.woodId, fairStock.woodId),
				eq(stock.place, fairPlace(fairId))
			)
		)
		.where(eq(fairStock.fairId, fairId))
		.orderBy(asc(pieces.title), asc(woods.name));
	return rows.map((r) => ({
		...r,
		unitMinor: r.basePriceMinor + r.priceAddOnMinor,
		onHand: r.onHand ?? 0
	}));
}
export type FairPiece = Awaited<ReturnType<typeof fairPieces>>[number];

/**
 * Reads the fair's open/closed state under a shared lock (MariaDB spells it LOCK IN SHARE MODE):
 * many sales may hold it at once, while a close (FOR UPDATE) waits for them and they for it.
 */
/**
 * The fair a stock change at `fair:<id>` goes to, under the same shared lock as the booth's
 * (the fair cannot close under the change); null when there is no such fair. Handed to
 * `adjustPieceStock`.
 */
export async function fairForStock(tx: Tx, fairId: number) {
	return fairStateShared(tx, fairId).catch((err: unknown) => {
		if (err instanceof DomainError) return null;
		throw err;
	});
}

export async function fairStateShared(tx: Tx, fairId: number) {
	const [rows] = (await tx.execute(
		sql`select name, closed_at as closedAt, sales_tax_bp as salesTaxBp, prices_include_tax as pricesIncludeTax, currency from fairs where id = ${fairId} lock in share mode`
	)) as unknown as [
		{
			name: string;
			closedAt: Date | null;
			salesTaxBp: number;
			pricesIncludeTax: number;
			currency: string;
		}[]
	];
	const row = rows[0];
	if (!row) throw new DomainError(404, 'There is no such fair.');
	// A raw query gets DATETIME back as the driver's 'YYYY-MM-DD hh:mm:ss' text in UTC.
	const closedAt =
		row.closedAt instanceof Date || row.closedAt === null
			? row.closedAt
			: new Date(`${String(row.closedAt).replace(' ', 'T')}Z`);
	return { ...row, closedAt, pricesIncludeTax: Boolean(row.pricesIncludeTax) };
}
