import { asc, eq } from 'drizzle-orm';
import { db, type Db, type Tx } from '../db';
import { cartLines, pieces, shippingRates, stock, woods, WORKSHOP } from '../db/schema';
import { getSalesTax } from '../settings/sales-tax';
import { getCarvingSchedule } from '../queue/carving-queue';
import { surchargeMinor, type CarvingSchedule } from '$lib/queue/carving-queue';
import { standardMinutes } from '$lib/queue/layout-minutes';
import { shopCurrency } from '$lib/locale/money';
import { lineTotal, onlineTax, type TaxBasis } from '$lib/tax/sales-tax';
import { shippingCharge, zoneFor, type RateRow } from '$lib/catalogue/shipping';
import type { Personalisation, PiecePattern } from '$lib/pattern/snapshot';
import { snapshotRefusal } from '../catalogue/personalise';

/**
 * Prices a cart from the database alone: unit prices, sales tax (the shop's rate and basis),
 * shipping by destination.
 * Used for the cart page and again, inside the order transaction, at checkout — so nothing the
 * browser says about money is ever used.
 */
export async function priceCart(cartId: string, country: string, conn: Db | Tx = db) {
	const rows = await conn
		.select({
			id: cartLines.id,
			quantity: cartLines.quantity,
			personalisation: cartLines.personalisation,
			pieceId: pieces.id,
			slug: pieces.slug,
			title: pieces.title,
			kind: pieces.kind,
			lengthMm: pieces.lengthMm,
			widthMm: pieces.widthMm,
			thicknessMm: pieces.thicknessMm,
			basePriceMinor: pieces.basePriceMinor,
			currency: pieces.currency,
			leadDays: pieces.leadDays,
			pattern: pieces.pattern,
			active: pieces.active,
			woodId: woods.id,
			woodSlug: woods.slug,
			woodName: woods.name,
			toneLight: woods.toneLight,
			toneDark: woods.toneDark,
			densityKgM3: woods.densityKgM3,
			priceAddOnMinor: woods.priceAddOnMinor
		})
		.from(cartLines)
		.innerJoin(pieces, eq(pieces.id, cartLines.pieceId))
		.innerJoin(woods, eq(woods.id, cartLines.woodId))
		.where(eq(cartLines.cartId, cartId))
		.orderBy(asc(cartLines.id));

	const stockRows = await conn
		.select({ pieceId: stock.pieceId, woodId: stock.woodId, quantity: stock.quantity })
		.from(stock)
		.where(eq(stock.place, WORKSHOP));
	const onHand = (pieceId: number, woodId: number) =>
		stockRows.find((s) => s.pieceId === pieceId && s.woodId === woodId)?.quantity ?? 0;

	const { rateBp, basis: taxBasis } = await getSalesTax(conn);
	const schedule = await getCarvingSchedule(conn);
	const rates = await conn.select().from(shippingRates);
	const currency = rows[0]?.currency ?? shopCurrency();
	const priced = priceLines(rows, { rateBp, taxBasis, schedule, rates, country });

	const problems: { lineId: number; message: string }[] = [];
	const lines = priced.lines.map((l) => {
		const available = onHand(l.pieceId, l.woodId);
		if (!l.active) problems.push({ lineId: l.id, message: `${l.title} is no longer offered.` });
		if (l.currency !== currency)
			problems.push({ lineId: l.id, message: `${l.title} is priced in another currency.` });
		const tooSmall = l.personalisation && snapshotRefusal(l.personalisation, l.woodSlug);
		if (tooSmall) problems.push({ lineId: l.id, message: `${l.title}: ${tooSmall}` });
		if (l.fromStock && available < l.quantity) {
			problems.push({
				lineId: l.id,
				message:
					available === 0
						? `${l.title} in ${l.woodName} is sold out.`
						: `Only ${available} ${l.title} in ${l.woodName} ready now.`
			});
		}
		return { ...l, available };
	});
	if (lines.length && !priced.shippingKnown) {
		problems.push({
			lineId: 0,
			message: 'This parcel is too heavy for our rates to that country; write to us.'
		});
	}
	return {
		lines,
		currency,
		country,
		zone: zoneFor(country),
		billableGrams: priced.billableGrams,
		rateBp,
		taxBasis,
		subtotalMinor: priced.subtotalMinor,
		taxMinor: priced.taxMinor,
		shippingMinor: priced.shippingMinor,
		shippingKnown: priced.shippingKnown,
		totalMinor: priced.totalMinor,
		count: lines.reduce((n, l) => n + l.quantity, 0),
		problems
	};
}

/** What pricing needs to know of one line: the piece, the wood, how many, and its snapshot. */
export type LineToPrice = {
	quantity: number;
	personalisation: Personalisation | null;
	kind: string;
	lengthMm: number;
	widthMm: number;
	thicknessMm: number;
	basePriceMinor: number;
	pattern: PiecePattern;
	woodSlug: string;
	densityKgM3: number;
	priceAddOnMinor: number;
};

/**
 * The shop's arithmetic for a set of lines, with no database: unit price (base, wood add-on and
 * the owner's optional carving surcharge), line total, sales tax by the shop's basis (per line or
 * once on the whole, `onlineTax`), shipping by billable weight to the destination, and the totals. The cart, checkout
 * and the demo seed all price through here.
 */
export function priceLines<L extends LineToPrice>(
	rows: L[],
	ctx: {
		rateBp: number;
		taxBasis: TaxBasis;
		schedule: CarvingSchedule;
		rates: RateRow[];
		country: string;
	}
) {
	const lines = rows.map((r) => {
		const personalisation = r.personalisation ?? null;
		// The owner's optional charge for carving beyond the piece's standard layout (0 when off).
		const extraMinor =
			personalisation && ctx.schedule.surchargePerMinuteMinor > 0
				? surchargeMinor(
						personalisation.estimateMinutes ?? 0,
						standardMinutes(r.pattern, r, r.woodSlug),
						ctx.schedule
					)
				: 0;
		const unitMinor = r.basePriceMinor + r.priceAddOnMinor + extraMinor;
		const totalMinor = lineTotal(unitMinor, r.quantity);
		return {
			...r,
			personalisation,
			unitMinor,
			totalMinor,
			// Personalised pieces are carved to order; plain ones come from finished stock.
			fromStock: !personalisation
		};
	});
	const ship = shippingCharge(
		ctx.rates,
		ctx.country,
		lines.map((l) => ({
			size: { kind: l.kind, lengthMm: l.lengthMm, widthMm: l.widthMm, thicknessMm: l.thicknessMm },
			densityKgM3: l.densityKgM3,
			quantity: l.quantity
		}))
	);
	const subtotalMinor = lines.reduce((n, l) => n + l.totalMinor, 0);
	const taxMinor = onlineTax(
		lines.map((l) => l.totalMinor),
		ctx.rateBp,
		ctx.taxBasis
	);
	const shippingMinor = ship.priceMinor ?? 0;
	return {
		lines,
		billableGrams: ship.billableGrams,
		subtotalMinor,
		taxMinor,
		shippingMinor,
		shippingKnown: ship.priceMinor !== null,
		totalMinor: subtotalMinor + taxMinor + shippingMinor
	};
}

export type PricedCart = Awaited<ReturnType<typeof priceCart>>;

/** Made-to-order lead: the longest lead of any personalised line (0 when all are ready now). */
export function leadDaysFor(lines: { fromStock: boolean; leadDays: number }[]) {
	return Math.max(0, ...lines.filter((l) => !l.fromStock).map((l) => l.leadDays));
}
