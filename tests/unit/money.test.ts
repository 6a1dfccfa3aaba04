import { describe, expect, it } from 'vitest';
import { formatMoney, minorDigits, parseMajor } from '$lib/locale/money';

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
