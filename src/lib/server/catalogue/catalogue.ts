import { PIECE_SLUG } from '$lib/forms/plain-text';
import { and, asc, eq, inArray, sql } from 'drizzle-orm';
import { db } from '../db';
import { photos, pieces, pieceWoods, stock, woods, WORKSHOP } from '../db/schema';
import { cachedCatalogue } from './cache';
import type { ShopQuery } from '$lib/catalogue/shop-query';
import { fromPriceMinor } from '$lib/catalogue/from-price';

export type WoodChoice = {
	id: number;
	slug: string;
	name: string;
	toneLight: string;
	toneDark: string;
	priceAddOnMinor: number;
	inStock: number;
};

export type PhotoRef = { storageKey: string; alt: string; width: number; height: number };

async function woodsFor(pieceIds: number[]) {
	if (pieceIds.length === 0) return new Map<number, WoodChoice[]>();
	const rows = await db
		.select({
			pieceId: pieceWoods.pieceId,
			id: woods.id,
			slug: woods.slug,
			name: woods.name,
			toneLight: woods.toneLight,
			toneDark: woods.toneDark,
			priceAddOnMinor: woods.priceAddOnMinor,
			inStock: sql<number>`coalesce((select sum(${stock.quantity}) from ${stock}
				where ${stock.pieceId} = ${pieceWoods.pieceId} and ${stock.woodId} = ${woods.id}
				and ${stock.place} = ${WORKSHOP}), 0)`.mapWith(Number)
		})
		.from(pieceWoods)
		.innerJoin(woods, eq(woods.id, pieceWoods.woodId))
		.where(inArray(pieceWoods.pieceId, pieceIds))
		.orderBy(asc(woods.priceAddOnMinor), asc(woods.name));
	const map = new Map<number, WoodChoice[]>();
	for (const { pieceId, ...w } of rows) {
		map.set(pieceId, [...(map.get(pieceId) ?? []), w]);
	}
	return map;
}

async function photosFor(pieceIds: number[]) {
	if (pieceIds.length === 0) return new Map<number, PhotoRef[]>();
	const rows = await db
		.select({
			pieceId: photos.pieceId,
			storageKey: photos.storageKey,
			alt: photos.alt,
			width: photos.width,
			height: photos.height
		})
		.from(photos)
		.where(inArray(photos.pieceId, pieceIds))
		.orderBy(asc(photos.position), asc(photos.id));
	const map = new Map<number, PhotoRef[]>();
	for (const { pieceId, ...p } of rows) map.set(pieceId, [...(map.get(pieceId) ?? []), p]);
	return map;
}

/**
 * The shop list: only the fields the list shows, filtered and sorted as the URL asks. Cached
 * per process until the catalogue changes (see catalogue-cache.ts); callers must not mutate it.
 */
export function listPieces(q: ShopQuery) {
	const key = `list:${q.kind ?? ''}:${q.wood ?? ''}:${q.ready ? 1 : 0}:${q.sort}`;
	return cachedCatalogue(key, () => readPieceList(q));
}

async function readPieceList(q: ShopQuery) {
	const rows = await db
		.select({
			id: pieces.id,
			slug: pieces.slug,
			title: pieces.title,
			kind: pieces.kind,
			summary: pieces.summary,
			basePriceMinor: pieces.basePriceMinor,
			currency: pieces.currency,
			personalisable: pieces.personalisable,
			leadDays: pieces.leadDays,
			createdAt: pieces.createdAt
		})
		.from(pieces)
		.where(and(eq(pieces.active, true), q.kind ? eq(pieces.kind, q.kind) : undefined));

	const ids = rows.map((r) => r.id);
	const [woodMap, photoMap] = await Promise.all([woodsFor(ids), photosFor(ids)]);

	let list = rows.map((r) => {
		const woodList = woodMap.get(r.id) ?? [];
		const shown = q.wood ? woodList.filter((w) => w.slug === q.wood) : woodList;
		const inStock = shown.reduce((n, w) => n + w.inStock, 0);
		const fromMinor = fromPriceMinor(r, shown);
		return {
			slug: r.slug,
			title: r.title,
			kind: r.kind,
			summary: r.summary,
			currency: r.currency,
			personalisable: r.personalisable,
			leadDays: r.leadDays,
			fromMinor,
			woods: woodList.map(({ slug, name, toneLight, toneDark }) => ({
				slug,
				name,
				toneLight,
				toneDark
			})),
			inStock,
			photo: photoMap.get(r.id)?.[0] ?? null,
			createdAt: r.createdAt.getTime(),
			matchesWood: !q.wood || shown.length > 0
		};
	});
	list = list.filter((p) => p.matchesWood && (!q.ready || p.inStock > 0));

	const byTitle = (a: { title: string }, b: { title: string }) => a.title.localeCompare(b.title);
	const sorters: Record<
		ShopQuery['sort'],
		(a: (typeof list)[number], b: (typeof list)[number]) => number
	> = {
		featured: (a, b) => Number(b.inStock > 0) - Number(a.inStock > 0) || byTitle(a, b),
		'price-low': (a, b) => a.fromMinor - b.fromMinor || byTitle(a, b),
		'price-high': (a, b) => b.fromMinor - a.fromMinor || byTitle(a, b),
		newest: (a, b) => b.createdAt - a.createdAt || byTitle(a, b)
	};
	list.sort(sorters[q.sort]);
	return list.map(({ matchesWood: _m, createdAt: _c, ...p }) => p);
}

/** Woods that appear on at least one active piece, for the filter. */
export function woodFilterOptions() {
	return cachedCatalogue('wood-filter', () => readWoodFilterOptions());
}

async function readWoodFilterOptions() {
	return db
		.selectDistinct({ slug: woods.slug, name: woods.name })
		.from(woods)
		.innerJoin(pieceWoods, eq(pieceWoods.woodId, woods.id))
		.innerJoin(pieces, and(eq(pieces.id, pieceWoods.pieceId), eq(pieces.active, true)))
		.orderBy(asc(woods.name));
}

/** One piece with everything its page shows; null when unknown or withdrawn. Cached like the list. */
export function getPiece(slug: string) {
	// The column's collation ignores some characters (a trailing NUL matched another piece):
	// only a well-formed slug is looked up at all.
	if (!PIECE_SLUG.test(slug)) return Promise.resolve(null);
	return cachedCatalogue(`piece:${slug}`, () => readPiece(slug));
}

async function readPiece(slug: string) {
	const [p] = await db
		.select()
		.from(pieces)
		.where(and(eq(pieces.slug, slug), eq(pieces.active, true)))
		.limit(1);
	if (!p) return null;
	const [woodMap, photoMap, facts] = await Promise.all([
		woodsFor([p.id]),
		photosFor([p.id]),
		db
			.select({
				slug: woods.slug,
				densityKgM3: woods.densityKgM3,
				sideHardnessN: woods.sideHardnessN,
				character: woods.character,
				caution: woods.caution
			})
			.from(woods)
			.innerJoin(pieceWoods, and(eq(pieceWoods.woodId, woods.id), eq(pieceWoods.pieceId, p.id)))
	]);
	const factBySlug = new Map(facts.map((f) => [f.slug, f]));
	const woodList = woodMap.get(p.id) ?? [];
	return {
		id: p.id,
		slug: p.slug,
		title: p.title,
		kind: p.kind,
		summary: p.summary,
		description: p.description,
		lengthMm: p.lengthMm,
		widthMm: p.widthMm,
		thicknessMm: p.thicknessMm,
		basePriceMinor: p.basePriceMinor,
		currency: p.currency,
		personalisable: p.personalisable,
		foodContact: p.foodContact,
		leadDays: p.leadDays,
		careNotes: p.careNotes,
		pattern: p.pattern,
		fromMinor: fromPriceMinor(p, woodList),
		photos: photoMap.get(p.id) ?? [],
		woods: woodList.map((w) => ({ ...w, ...factBySlug.get(w.slug)! }))
	};
}

export type PieceDetail = NonNullable<Awaited<ReturnType<typeof readPiece>>>;

/**
 * Personalisable pieces whose rosette is larger than `diameterMm`, smallest first, with their
 * woods: where the personaliser sends a buyer whose initials do not fit a small rosette.
 * Cached like the list.
 */
export function largerRosettePieces(diameterMm: number) {
	return cachedCatalogue(`larger:${diameterMm}`, async () => {
		const rows = await db
			.select({ id: pieces.id, slug: pieces.slug, title: pieces.title, pattern: pieces.pattern })
			.from(pieces)
			.where(and(eq(pieces.active, true), eq(pieces.personalisable, true)));
		const larger = rows
			.filter((p) => p.pattern.diameterMm > diameterMm)
			.sort(
				(a, b) => a.pattern.diameterMm - b.pattern.diameterMm || a.title.localeCompare(b.title)
			);
		const woodMap = await woodsFor(larger.map((p) => p.id));
		return larger.map((p) => ({
			slug: p.slug,
			title: p.title,
			diameterMm: p.pattern.diameterMm,
			woods: (woodMap.get(p.id) ?? []).map((w) => w.slug)
		}));
	});
}
