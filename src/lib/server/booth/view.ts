import { isoDay, today as todayIso } from '$lib/locale/dates';
import { and, asc, eq } from 'drizzle-orm';
import { db } from '../db';
import { pieces, pieceWoods, shippingRates, woods } from '../db/schema';
import { personalisedPriceMinor } from '$lib/catalogue/personalised-price';
import { fairPieces, getFair } from '../fairs/fairs';
import { boothEntries } from './tally';

/**
 * What the booth screen needs, and no more: the fair's pieces with prices, what can be ordered
 * personalised, and today's sales by method — counts for everyone, money only for the owner.
 */
export async function boothView(fairId: number, owner: boolean, today = todayIso()) {
	const fair = await getFair(fairId);
	const [stockLines, entries, orderable, rates] = await Promise.all([
		fairPieces(fairId),
		boothEntries(fairId),
		db
			.select({
				pieceSlug: pieces.slug,
				title: pieces.title,
				woodSlug: woods.slug,
				woodName: woods.name,
				base: pieces.basePriceMinor,
				addOn: woods.priceAddOnMinor,
				kind: pieces.kind,
				lengthMm: pieces.lengthMm,
				widthMm: pieces.widthMm,
				thicknessMm: pieces.thicknessMm,
				densityKgM3: woods.densityKgM3
			})
			.from(pieces)
			.innerJoin(pieceWoods, eq(pieceWoods.pieceId, pieces.id))
			.innerJoin(woods, eq(woods.id, pieceWoods.woodId))
			.where(and(eq(pieces.personalisable, true), eq(pieces.active, true)))
			.orderBy(asc(pieces.title), asc(woods.name)),
		db
			.select({
				zone: shippingRates.zone,
				upToGrams: shippingRates.upToGrams,
				priceMinor: shippingRates.priceMinor
			})
			.from(shippingRates)
	]);
	const todays = entries.filter(
		(e) => e.kind === 'sale' && !e.voidedAt && isoDay(e.soldAt) === today
	);
	const label = new Map(stockLines.map((p) => [`${p.pieceId}/${p.woodId}`, p.title]));
	// The day's sales, to check and to void: a helper sees pieces, the owner the amounts too.
	const sales = entries
		.filter((e) => e.kind === 'sale' && (owner || isoDay(e.soldAt) === today))
		.slice(-200)
		.reverse()
		.map((e) => ({
			id: e.id,
			at: e.soldAt.toISOString(),
			summary: e.lines
				.map((l) => `${l.quantity} × ${label.get(`${l.pieceId}/${l.woodId}`) ?? 'piece'}`)
				.join(', '),
			totalMinor: owner ? e.totalMinor : null,
			voided: Boolean(e.voidedAt),
			late: e.late
		}));
	const day = (['cash', 'card', 'other'] as const).map((method) => {
		const of = todays.filter((e) => e.method === method);
		return {
			method,
			count: of.length,
			totalMinor: owner ? of.reduce((a, e) => a + e.totalMinor, 0) : null
		};
	});
	return {
		fair: {
			id: fair.id,
			name: fair.name,
			currency: fair.currency,
			salesTaxBp: fair.salesTaxBp,
			pricesIncludeTax: fair.pricesIncludeTax,
			helperDiscountBp: fair.helperDiscountBp,
			startsOn: fair.startsOn,
			endsOn: fair.endsOn,
			closed: Boolean(fair.closedAt)
		},
		sales,
		pieces: stockLines.map((p) => ({
			pieceSlug: p.pieceSlug,
			woodSlug: p.woodSlug,
			title: p.title,
			woodName: p.woodName,
			unitMinor: p.unitMinor,
			onHand: p.onHand
		})),
		orderable: orderable.map((o) => ({ ...o, unitMinor: personalisedPriceMinor(o.base, o.addOn) })),
		// The shop's postage table, so the order form can show what posting a piece costs.
		rates,
		day,
		owner
	};
}
