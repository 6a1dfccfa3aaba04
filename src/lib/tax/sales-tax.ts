/**
 * Sales tax: the shop's two rules and its one rounding, pure and in integer minor units. Every
 * place that works out tax (basket, checkout, booth sale, booth order, booth sync, tally, seed
 * scripts) calls this file; nothing else rounds tax (kept by `tests/unit/tax-rules.test.ts`).
 *
 * The rounding (half-up): tax is rounded to the minor unit once, half a minor unit going up. For
 * dollars this is "carry the tax to the third decimal place and round up when that place is more
 * than four", the rounding rule of the Streamlined Sales and Use Tax Agreement, §324, which also
 * lets a seller work tax out on an item or an invoice basis. The rate is in basis points
 * (7.25 % → 725), so tax = amount × rate / 10 000, worked in whole numbers, never floats.
 *
 * The two rules:
 * - Online, item basis (the default): tax on each line (unit price × quantity), each line rounded
 *   once, then summed. Two different pieces at 12.10 each, 7.25 %: 12.10 × 0.0725 = 0.87725 → 0.88
 *   per line, 1.76 in all.
 * - Online, invoice basis (the owner's choice in Settings), and every booth sale: tax once on the
 *   whole amount, rounded once. The same basket: 24.20 × 0.0725 = 1.7545 → 1.75. At the booth the
 *   amount is the sale after its discount: two at 18.00 less 6.00 = 30.00 × 6 % = 1.80.
 *
 * Booth prices may already hold the tax (a fair's "prices include tax"): then the net is the
 * price ÷ (1 + rate), rounded half-up, and the tax is what is left: 21.45 at 7.25 % is a net of
 * 21.45 / 1.0725 = 20.00, so 1.45 of it is tax.
 */

/** How online tax is worked out: per line (`item`) or once on the basket (`invoice`). */
export const TAX_BASES = ['item', 'invoice'] as const;
export type TaxBasis = (typeof TAX_BASES)[number];
/** What online orders used before the owner could choose: per line. */
export const DEFAULT_TAX_BASIS: TaxBasis = 'item';

const BP = 10_000;

function assertWhole(n: number, what: string) {
	if (!Number.isSafeInteger(n) || n < 0) throw new Error(`${what} must be a whole number ≥ 0`);
}

/**
 * a·b / c rounded half-up, for whole numbers a, b ≥ 0 and c > 0: the project's one half-up.
 * floor((2ab + c) / 2c) adds half of c before dividing, so a remainder of exactly half goes up.
 */
export function mulDivHalfUp(a: number, b: number, c: number): number {
	if (a < 0 || b < 0 || c <= 0) throw new Error('mulDivHalfUp takes non-negative numbers');
	return Math.floor((2 * a * b + c) / (2 * c));
}

/** Line total: unit price × quantity, exact in minor units. */
export function lineTotal(unitMinor: number, quantity: number): number {
	if (!Number.isSafeInteger(unitMinor)) throw new Error(`Amount must be whole minor units`);
	if (!Number.isInteger(quantity) || quantity < 0)
		throw new Error('Quantity must be a whole number');
	return unitMinor * quantity;
}

/** Tax added to an amount (price tags before tax), rounded once, half-up. */
export function taxOn(amountMinor: number, rateBp: number): number {
	assertWhole(amountMinor, 'The taxed amount');
	assertWhole(rateBp, 'The tax rate in basis points');
	return mulDivHalfUp(amountMinor, rateBp, BP);
}

/** Tax held inside an amount whose price tags already include it (the net rounded half-up). */
export function taxWithin(amountMinor: number, rateBp: number): number {
	assertWhole(amountMinor, 'The taxed amount');
	assertWhole(rateBp, 'The tax rate in basis points');
	return amountMinor - mulDivHalfUp(amountMinor, BP, BP + rateBp);
}

/** Online tax on a basket's line totals, by the shop's chosen basis. */
export function onlineTax(lineTotals: number[], rateBp: number, basis: TaxBasis): number {
	if (basis === 'invoice')
		return taxOn(
			lineTotals.reduce((a, l) => a + l, 0),
			rateBp
		);
	return lineTotals.reduce((a, l) => a + taxOn(l, rateBp), 0);
}

/** Tax on one booth sale (invoice basis): added to the amount, or taken out of it. */
export function saleTax(amountMinor: number, rateBp: number, pricesIncludeTax: boolean) {
	if (pricesIncludeTax) {
		const taxMinor = taxWithin(amountMinor, rateBp);
		return { taxableMinor: amountMinor - taxMinor, taxMinor, totalMinor: amountMinor };
	}
	const taxMinor = taxOn(amountMinor, rateBp);
	return { taxableMinor: amountMinor, taxMinor, totalMinor: amountMinor + taxMinor };
}
