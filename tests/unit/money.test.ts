import { describe, expect, it } from 'vitest';
import {
	formatMoney,
	lineTax,
	lineTotal,
	minorDigits,
	parseMajor,
	totals
} from '$lib/locale/money';

describe('minor units per currency', () => {
	it('follows ISO 4217 minor-unit digits', () => {
		// ISO 4217 currency code list, "minor unit" column: USD 2, EUR 2, GBP 2, JPY 0.
		expect(minorDigits('USD')).toBe(2);
		expect(minorDigits('EUR')).toBe(2);
		expect(minorDigits('GBP')).toBe(2);
		expect(minorDigits('JPY')).toBe(0);
		expect(() => minorDigits('XYZ')).toThrow();
	});

	it('formats amounts with the currency’s own decimals', () => {
		// Reference: the ICU data behind Intl.NumberFormat, which follows ISO 4217 digits.
		expect(formatMoney(1234, 'USD')).toBe('$12.34');
		expect(formatMoney(1234, 'JPY')).toBe('¥1,234');
		expect(formatMoney(1234, 'EUR', 'de-DE')).toBe('12,34\u00a0€');
		expect(formatMoney(5, 'GBP', 'en-GB')).toBe('£0.05');
		expect(() => formatMoney(12.5, 'USD')).toThrow();
	});

	it('parses typed amounts without float drift', () => {
		// 0.1 + 0.2 style drift would give 1289.9999…; the parser works on the digits.
		expect(parseMajor('12.90', 'USD')).toBe(1290);
		expect(parseMajor('0.29', 'USD')).toBe(29);
		expect(parseMajor('1500', 'JPY')).toBe(1500);
		expect(parseMajor('15.5', 'JPY')).toBeNull();
		expect(parseMajor('abc', 'USD')).toBeNull();
	});
});

describe('line totals and tax rounding', () => {
	it('multiplies unit by quantity exactly', () => {
		expect(lineTotal(1999, 3)).toBe(5997);
		expect(() => lineTotal(1999, 1.5)).toThrow();
	});

	it('rounds tax once per line, half-up', () => {
		// Our stated rule: tax = line total × rate, rounded half-up to the minor unit, once per line.
		// 10.00 × 7.25 % = 0.725 → 0.73 (half goes up).
		expect(lineTax(1000, 725)).toBe(73);
		// 10.00 × 7.24 % = 0.724 → 0.72.
		expect(lineTax(1000, 724)).toBe(72);
		// Worked example (hand arithmetic): 3 × 19.99 = 59.97; × 8.87 % = 5.319339 → 5.32 on the line.
		// Rounding per unit instead would give 3 × round(1.773113) = 3 × 1.77 = 5.31, so this check
		// tells the two rules apart.
		expect(lineTax(lineTotal(1999, 3), 887)).toBe(532);
		// 2.00 × 7.25 % = 0.145 → 0.15: exactly half a cent goes up.
		expect(lineTax(200, 725)).toBe(15);
		expect(lineTax(5000, 0)).toBe(0);
	});

	it('sums per-line tax into the order total', () => {
		const t = totals(
			[
				{ unitMinor: 1999, quantity: 3 },
				{ unitMinor: 4500, quantity: 1 }
			],
			725,
			1250
		);
		// 59.97 × 7.25 % = 4.3478 → 4.35; 45.00 × 7.25 % = 3.2625 → 3.26 (hand arithmetic).
		expect(t).toEqual({
			subtotalMinor: 10497,
			taxMinor: 761,
			shippingMinor: 1250,
			totalMinor: 12508
		});
	});
});
