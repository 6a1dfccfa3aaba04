/**
 * Sales tax (`$lib/tax/sales-tax`) against the Streamlined Sales and Use Tax Agreement, §324
 * ("Rounding Rule"), as adopted into state law, e.g. R.I. Gen. Laws § 44-18.1-25, N.D. Cent. Code
 * § 57-39.4-25, RCW 82.08.054 (Washington), Kan. Stat. § 79-3676:
 *   (A)(1) tax computation must be carried to the third decimal place, and (2) the tax must be
 *   rounded to a whole cent using a method that rounds up to the next cent whenever the third
 *   decimal place is greater than four. (B) sellers may elect to compute the tax due on a
 *   transaction on an item or an invoice basis.
 * Each example below is worked by hand in its comment (amounts in dollars, 7.25 % = 0.0725).
 * The booth's "prices include tax" split is common practice (net = price ÷ (1 + rate)), from
 * memory, not from §324.
 */
import { describe, expect, it } from 'vitest';
import { lineTotal, mulDivHalfUp, onlineTax, saleTax, taxOn, taxWithin } from '$lib/tax/sales-tax';

/**
 * §324 (A) as written, on decimal digits: carry the tax (amount in cents × rate in basis points,
 * i.e. dollars × 10⁻⁶ … ) to the third decimal place of a dollar by truncating, then go up one
 * cent when that third digit is more than four. A second, separate way of working it out, not the module's
 * formula: it never adds a half.
 */
function section324Cents(amountCents: number, rateBp: number): number {
	// Exact tax in millionths of a dollar is amountCents × rateBp (cents 10⁻², basis points 10⁻⁴).
	const millionths = BigInt(amountCents) * BigInt(rateBp);
	const thousandths = millionths / 1000n; // carried to the third decimal place
	const cents = thousandths / 10n;
	const thirdDecimal = thousandths % 10n;
	return Number(thirdDecimal > 4n ? cents + 1n : cents);
}

describe('SSUTA §324: carried to the third decimal place, up when it is more than four', () => {
	it('goes up when the third decimal place is 5 or more', () => {
		// 10.00 × 0.0725 = 0.725: third decimal 5 > 4 → 0.73.
		expect(taxOn(1000, 725)).toBe(73);
		// 12.10 × 0.0725 = 0.87725: third decimal 7 → 0.88.
		expect(taxOn(1210, 725)).toBe(88);
		// 2.00 × 0.0725 = 0.145: third decimal 5 → 0.15.
		expect(taxOn(200, 725)).toBe(15);
		// 19.99 × 0.0625 = 1.249375: third decimal 9 → 1.25.
		expect(taxOn(1999, 625)).toBe(125);
	});

	it('stays down when the third decimal place is 4 or less', () => {
		// 10.00 × 0.0724 = 0.724: third decimal 4 → 0.72.
		expect(taxOn(1000, 724)).toBe(72);
		// 1.99 × 0.0725 = 0.144275: third decimal 4 → 0.14.
		expect(taxOn(199, 725)).toBe(14);
		// 24.20 × 0.0725 = 1.7545: third decimal 4 → 1.75. Only the third place counts: rounding
		// to three places first (1.755) and then to cents would wrongly give 1.76.
		expect(taxOn(2420, 725)).toBe(175);
		expect(taxOn(5000, 0)).toBe(0);
	});

	it('agrees with §324 as written for every amount up to 30.00 at common rates', () => {
		// Rates like US combined rates (from memory), plus the smallest step and the form's limit.
		for (const rate of [1, 400, 600, 625, 725, 887, 1000, 2500])
			for (let cents = 0; cents <= 3000; cents++)
				expect(taxOn(cents, rate), `${cents}¢ at ${rate} bp`).toBe(section324Cents(cents, rate));
	});
});

describe('item basis (online, the default): each line rounded, then summed', () => {
	it('rounds a line once on its total, not per unit', () => {
		// 3 × 19.99 = 59.97; × 0.0887 = 5.319339 → 5.32 on the line. Per unit it would be
		// 1.773113 → 1.77, × 3 = 5.31: the check tells the two apart.
		expect(lineTotal(1999, 3)).toBe(5997);
		expect(onlineTax([lineTotal(1999, 3)], 887, 'item')).toBe(532);
	});

	it('sums the rounded lines', () => {
		// Two pieces at 12.10: 0.87725 → 0.88 each, 1.76 in all.
		expect(onlineTax([1210, 1210], 725, 'item')).toBe(176);
		// 1.00 and 1.00: 0.0725 → 0.07 each, 0.14 in all.
		expect(onlineTax([100, 100], 725, 'item')).toBe(14);
		// 59.97 → 4.347825 → 4.35; 45.00 → 3.2625 → 3.26; 7.61 in all.
		expect(onlineTax([5997, 4500], 725, 'item')).toBe(761);
	});
});

describe('invoice basis (online by choice, every booth sale): once on the whole', () => {
	it('rounds the sum once', () => {
		// 24.20 × 0.0725 = 1.7545 → 1.75 (the item basis gave 1.76 on the same basket).
		expect(onlineTax([1210, 1210], 725, 'invoice')).toBe(175);
		// 2.00 × 0.0725 = 0.145 → 0.15 (the item basis gave 0.14).
		expect(onlineTax([100, 100], 725, 'invoice')).toBe(15);
		// 104.97 × 0.0725 = 7.610325 → 7.61 (here both bases agree).
		expect(onlineTax([5997, 4500], 725, 'invoice')).toBe(761);
		expect(onlineTax([], 725, 'invoice')).toBe(0);
	});

	it('adds tax to a booth sale', () => {
		// 30.00 × 0.06 = 1.80 → paid 31.80.
		expect(saleTax(3000, 600, false)).toEqual({
			taxableMinor: 3000,
			taxMinor: 180,
			totalMinor: 3180
		});
	});

	it('takes tax out of a booth price that holds it (common practice, from memory)', () => {
		// 21.45 ÷ 1.0725 = 20.00 net, so 1.45 of it is tax.
		expect(saleTax(2145, 725, true)).toEqual({
			taxableMinor: 2000,
			taxMinor: 145,
			totalMinor: 2145
		});
		// 0.04 at 60 %: net 0.04 ÷ 1.6 = 0.025 → 0.03 (half up), so 0.01 tax.
		expect(taxWithin(4, 6000)).toBe(1);
		// 0.03 at 60 %: net 0.01875 → 0.02, so 0.01 tax.
		expect(taxWithin(3, 6000)).toBe(1);
		expect(taxWithin(2145, 0)).toBe(0);
	});
});

describe('the one half-up and its guards', () => {
	it('sends exactly half up and less than half down', () => {
		// 1 × 1 / 2 = 0.5 → 1; 1 × 1 / 3 = 0.333… → 0; 5 × 1 / 3 = 1.666… → 2.
		expect(mulDivHalfUp(1, 1, 2)).toBe(1);
		expect(mulDivHalfUp(1, 1, 3)).toBe(0);
		expect(mulDivHalfUp(5, 1, 3)).toBe(2);
	});

	it('refuses fractions of a cent, negative amounts and fractional rates', () => {
		expect(() => taxOn(12.5, 725)).toThrow();
		expect(() => taxOn(-100, 725)).toThrow();
		expect(() => taxOn(100, 72.5)).toThrow();
		expect(() => lineTotal(1999, 1.5)).toThrow();
	});
});
