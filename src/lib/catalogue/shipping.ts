/**
 * Parcel weight and shipping charge. Pure: the rate table comes from the database.
 *
 * Dimensional weight: we ship from the US with UPS/FedEx-style daily rates, so we use their
 * divisor, 139 in³/lb, rounding each box dimension to the nearest inch and the result up to the
 * next whole pound (the carriers' published rate guides, as recalled). `dimWeightKg` gives the
 * DHL Express metric form (5000 cm³/kg) for owners who ship with it.
 */

export const MM_PER_INCH = 25.4; // exact, 1959 international yard and pound agreement
export const GRAMS_PER_LB = 453.59237; // exact, same agreement
export const DIM_DIVISOR_IN3_PER_LB = 139;
export const DIM_DIVISOR_CM3_PER_KG = 5000;

/** Wrapping and box: padding on every side and the carton's own weight. Our own allowance. */
export const PACKAGING = { paddingMm: 25, grams: 180 };

/** Share of the bounding box a piece of each kind fills (a round plate fills π/4). Our estimate. */
export const FILL_BY_KIND: Record<string, number> = {
	plate: Math.PI / 4,
	ornament: Math.PI / 4,
	box: 0.5,
	spoon: 0.35,
	bottle_holder: 1,
	board: 1
};

export type PieceSize = { kind: string; lengthMm: number; widthMm: number; thicknessMm: number };

/** Wood weight in grams: volume (m³) × density (kg/m³) × 1000. */
export function woodGrams(volumeMm3: number, densityKgM3: number): number {
	return (volumeMm3 / 1e9) * densityKgM3 * 1000;
}

export function pieceVolumeMm3(p: PieceSize): number {
	return p.lengthMm * p.widthMm * p.thicknessMm * (FILL_BY_KIND[p.kind] ?? 1);
}

/** A piece ready to post: wood weight plus packaging, in whole grams (rounded up). */
export function packedGrams(p: PieceSize, densityKgM3: number): number {
	return Math.ceil(woodGrams(pieceVolumeMm3(p), densityKgM3) + PACKAGING.grams);
}

export function boxMm(p: PieceSize): [number, number, number] {
	const pad = 2 * PACKAGING.paddingMm;
	return [p.lengthMm + pad, p.widthMm + pad, p.thicknessMm + pad];
}

/** UPS/FedEx dimensional weight in whole pounds: dims to nearest inch, /139, up to whole lb. */
export function dimWeightLb(lengthIn: number, widthIn: number, heightIn: number): number {
	const l = Math.round(lengthIn);
	const w = Math.round(widthIn);
	const h = Math.round(heightIn);
	return Math.ceil((l * w * h) / DIM_DIVISOR_IN3_PER_LB);
}

/** DHL Express dimensional weight in kg (unrounded): cm³ / 5000. */
export function dimWeightKg(lengthCm: number, widthCm: number, heightCm: number): number {
	return (lengthCm * widthCm * heightCm) / DIM_DIVISOR_CM3_PER_KG;
}

export type ParcelItem = { size: PieceSize; densityKgM3: number; quantity: number };

/**
 * Billable grams for a set of pieces sent as one carton whose volume is the sum of the single
 * boxes (a simplification: pieces nest rather than stack in exact shapes). Carriers bill the
 * greater of actual weight and dimensional weight, each rounded up to the whole pound.
 */
export function billableGrams(items: ParcelItem[]): {
	actualGrams: number;
	dimGrams: number;
	billable: number;
} {
	let actual = 0;
	let volumeIn3 = 0;
	for (const it of items) {
		actual += packedGrams(it.size, it.densityKgM3) * it.quantity;
		const [l, w, h] = boxMm(it.size).map((mm) => Math.round(mm / MM_PER_INCH));
		volumeIn3 += l * w * h * it.quantity;
	}
	const dimLb = Math.ceil(volumeIn3 / DIM_DIVISOR_IN3_PER_LB);
	const actualLb = Math.ceil(actual / GRAMS_PER_LB);
	const billableLb = Math.max(actualLb, dimLb);
	return {
		actualGrams: actual,
		dimGrams: Math.round(dimLb * GRAMS_PER_LB),
		billable: Math.round(billableLb * GRAMS_PER_LB)
	};
}

export const ZONES = ['domestic', 'north_america', 'world'] as const;
export type Zone = (typeof ZONES)[number];

/** The shop posts from the United States. */
export const HOME_COUNTRY = 'US';

export function zoneFor(country: string): Zone {
	const c = country.toUpperCase();
	if (c === HOME_COUNTRY) return 'domestic';
	if (c === 'CA' || c === 'MX') return 'north_america';
	return 'world';
}

export type RateRow = { zone: string; upToGrams: number; priceMinor: number };

/** The first band in the zone whose limit covers the billable weight; null when too heavy. */
export function rateFor(rates: RateRow[], zone: Zone, grams: number): number | null {
	const band = rates
		.filter((r) => r.zone === zone && r.upToGrams >= grams)
		.sort((a, b) => a.upToGrams - b.upToGrams)[0];
	return band ? band.priceMinor : null;
}

export function shippingCharge(rates: RateRow[], country: string, items: ParcelItem[]) {
	if (items.length === 0) return { zone: zoneFor(country), priceMinor: 0, billableGrams: 0 };
	const zone = zoneFor(country);
	const { billable } = billableGrams(items);
	return { zone, priceMinor: rateFor(rates, zone, billable), billableGrams: billable };
}
