import { majorText, shopCurrency } from '$lib/locale/money';
/**
 * The owner's side of the catalogue: every piece (retired ones too), create, edit, retire.
 * A retired piece leaves the shop (the shop reads active pieces only) but its row stays, so the
 * orders that name it keep their lines.
 */
import { asc, eq, sql } from 'drizzle-orm';
import { db } from '../db';
import { photos, pieces, pieceWoods, woods } from '../db/schema';
import type { PieceForm } from '$lib/catalogue/piece-schema';
import type { PiecePattern } from '../db/schema';
import { isDuplicateKey, transact } from '../db/retry';

import { DomainError } from '../errors/domain-error';

export async function listAllPieces() {
	return db
		.select({
			id: pieces.id,
			slug: pieces.slug,
			title: pieces.title,
			kind: pieces.kind,
			basePriceMinor: pieces.basePriceMinor,
			currency: pieces.currency,
			personalisable: pieces.personalisable,
			leadDays: pieces.leadDays,
			active: pieces.active,
			photoCount:
				sql<number>`(select count(*) from ${photos} where ${photos.pieceId} = ${pieces.id})`.mapWith(
					Number
				)
		})
		.from(pieces)
		.orderBy(sql`${pieces.active} desc`, asc(pieces.title));
}

export async function allWoods() {
	return db.select({ id: woods.id, name: woods.name }).from(woods).orderBy(asc(woods.name));
}

/** The piece as its edit form shows it; null when there is no such piece. */
export async function pieceForEdit(id: number) {
	const [p] = await db.select().from(pieces).where(eq(pieces.id, id)).limit(1);
	if (!p) return null;
	const woodRows = await db
		.select({ woodId: pieceWoods.woodId })
		.from(pieceWoods)
		.where(eq(pieceWoods.pieceId, id));
	const pattern = p.pattern;
	return {
		id: p.id,
		active: p.active,
		values: {
			title: p.title,
			slug: p.slug,
			kind: p.kind,
			summary: p.summary,
			description: p.description,
			lengthMm: String(p.lengthMm),
			widthMm: String(p.widthMm),
			thicknessMm: String(p.thicknessMm),
			price: majorText(p.basePriceMinor, p.currency),
			leadDays: String(p.leadDays),
			diameterMm: String(pattern.diameterMm),
			count: String(pattern.count),
			spacingMm: String(pattern.spacingMm ?? 0),
			careNotes: p.careNotes ?? '',
			personalisable: p.personalisable,
			foodContact: p.foodContact,
			split: !!pattern.split,
			woodIds: woodRows.map((w) => w.woodId)
		}
	};
}

function columns(f: PieceForm) {
	return {
		title: f.title,
		slug: f.slug,
		kind: f.kind,
		summary: f.summary,
		description: f.description,
		lengthMm: f.lengthMm,
		widthMm: f.widthMm,
		thicknessMm: f.thicknessMm,
		basePriceMinor: f.price,
		personalisable: f.personalisable,
		foodContact: f.foodContact,
		leadDays: f.leadDays,
		pattern: {
			diameterMm: f.diameterMm,
			count: f.count,
			spacingMm: f.spacingMm,
			split: f.split
		} satisfies PiecePattern,
		careNotes: f.careNotes || null
	};
}

/** MariaDB's duplicate-key error (1062) on the slug becomes a message for the slug field. */
async function slugSafe<T>(run: () => Promise<T>): Promise<T> {
	try {
		return await run();
	} catch (err) {
		if (isDuplicateKey(err)) {
			const message = 'Another piece already uses this address.';
			throw new DomainError(400, message, { fields: { slug: [message] } });
		}
		throw err;
	}
}

/** Piece and its woods in one transaction. Returns the new id. */
export async function createPiece(f: PieceForm): Promise<number> {
	return slugSafe(() =>
		transact(async (tx) => {
			const [{ id }] = await tx
				.insert(pieces)
				.values({ ...columns(f), currency: shopCurrency(), createdAt: new Date() })
				.$returningId();
			await tx.insert(pieceWoods).values(f.woodIds.map((woodId) => ({ pieceId: id, woodId })));
			return id;
		})
	);
}

/** Rewrites the piece and its wood list together; false when the piece is gone. */
export async function updatePiece(id: number, f: PieceForm): Promise<boolean> {
	return slugSafe(() =>
		transact(async (tx) => {
			const [row] = await tx
				.select({ id: pieces.id })
				.from(pieces)
				.where(eq(pieces.id, id))
				.for('update');
			if (!row) return false;
			await tx.update(pieces).set(columns(f)).where(eq(pieces.id, id));
			await tx.delete(pieceWoods).where(eq(pieceWoods.pieceId, id));
			await tx.insert(pieceWoods).values(f.woodIds.map((woodId) => ({ pieceId: id, woodId })));
			return true;
		})
	);
}

/** Retire (leaves the shop) or bring back; false when the piece is gone. */
export async function setPieceActive(id: number, active: boolean): Promise<boolean> {
	const res = await db.update(pieces).set({ active }).where(eq(pieces.id, id));
	return res[0].affectedRows > 0;
}

/** Only known wood ids are accepted (the form posts ids). */
export async function unknownWoodIds(ids: number[]) {
	const known = new Set((await allWoods()).map((w) => w.id));
	return ids.filter((id) => !known.has(id));
}
