import { asc, eq } from 'drizzle-orm';
import { db, type Db, type Tx } from '../db';
import { cartLines, pieces, shippingRates, stock, woods, WORKSHOP } from '../db/schema';
import { getSalesTaxBp } from '../settings';
import { getCarvingSchedule } from '../orders/carving-queue';
import { surchargeMinor } from '$lib/carving-queue';
import { standardMinutes } from '$lib/layout-minutes';
import { lineTax, lineTotal } from '$lib/money';
import { shippingCharge, zoneFor } from '$lib/shipping';

/**
 * Prices a cart from the database alone: unit prices, per-line tax, shipping by destination.
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

	const rateBp = await getSalesTaxBp(conn);
	const schedule = await getCarvingSchedule(conn);
	const currency = rows[0]?.currency ?? 'USD';
	const problems: { lineId: number; message: string }[] = [];

	const lines = rows.map((r) => {
		const personalisation = r.personalisation ?? null;
		// The owner's optional charge for carving beyond the piece's standard layout (0 when off).
		const extraMinor =
			personalisation && schedule.surchargePerMinuteMinor > 0
				? surchargeMinor(
						personalisation.estimateMinutes ?? 0,
						standardMinutes(r.pattern, r, r.woodSlug),
						schedule
					)
				: 0;
		const unitMinor = r.basePriceMinor + r.priceAddOnMinor + extraMinor;
		const totalMinor = lineTotal(unitMinor, r.quantity);
		// Personalised pieces are carved to order; plain ones come from finished stock.
		const fromStock = !personalisation;
		const available = onHand(r.pieceId, r.woodId);
		if (!r.active) problems.push({ lineId: r.id, message: `${r.title} is no longer offered.` });
		if (r.currency !== currency)
			problems.push({ lineId: r.id, message: `${r.title} is priced in another currency.` });
		if (fromStock && available < r.quantity) {
			problems.push({
				lineId: r.id,
				message:
					available === 0
						? `${r.title} in ${r.woodName} is sold out.`
						: `Only ${available} ${r.title} in ${r.woodName} ready now.`
			});
		}
		return {
			...r,
			personalisation,
			unitMinor,
			totalMinor,
			taxMinor: lineTax(totalMinor, rateBp),
			fromStock,
			available
		};
	});

	const rates = await conn.select().from(shippingRates);
	const ship = shippingCharge(
		rates,
		country,
		lines.map((l) => ({
			size: { kind: l.kind, lengthMm: l.lengthMm, widthMm: l.widthMm, thicknessMm: l.thicknessMm },
			densityKgM3: l.densityKgM3,
			quantity: l.quantity
		}))
	);
	if (lines.length && ship.priceMinor === null) {
		problems.push({
			lineId: 0,
			message: 'This parcel is too heavy for our rates to that country; write to us.'
		});
	}
	const subtotalMinor = lines.reduce((n, l) => n + l.totalMinor, 0);
	const taxMinor = lines.reduce((n, l) => n + l.taxMinor, 0);
	const shippingMinor = ship.priceMinor ?? 0;
	return {
		lines,
		currency,
		country,
		zone: zoneFor(country),
		billableGrams: ship.billableGrams,
		rateBp,
		subtotalMinor,
		taxMinor,
		shippingMinor,
		shippingKnown: ship.priceMinor !== null,
		totalMinor: subtotalMinor + taxMinor + shippingMinor,
		count: lines.reduce((n, l) => n + l.quantity, 0),
		problems
	};
}

export type PricedCart = Awaited<ReturnType<typeof priceCart>>;

/** Made-to-order lead: the longest lead of any personalised line (0 when all are ready now). */
export function leadDaysFor(lines: { fromStock: boolean; leadDays: number }[]) {
	return Math.max(0, ...lines.filter((l) => !l.fromStock).map((l) => l.leadDays));
}
