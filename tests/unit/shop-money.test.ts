/**
 * Amounts written the shop's way: the one formatter in $lib/locale/money takes the shop's currency and
 * locale from settings ($lib/locale/shop-format), so a switch of settings changes every price with no
 * code change. Expected strings are the ICU/CLDR conventions behind Intl.NumberFormat (German
 * writes "1.234,56 €" with a no-break space before the sign; US English "$1,234.56").
 */
import { afterEach, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
	formatMoney,
	formatRate,
	majorText,
	parseMajor,
	percentText,
	shopCurrency,
	toMajor
} from '$lib/locale/money';
import { DEFAULT_FORMAT, useShopFormat } from '$lib/locale/shop-format';
import { fairFormValues } from '$lib/fairs/form-values';
import { priceMinor } from '$lib/catalogue/piece-schema';
import { moneyField } from '$lib/fairs/schemas';

afterEach(() => useShopFormat(DEFAULT_FORMAT));

describe("the shop's currency and locale", () => {
	it('writes US dollars in US English by default', () => {
		expect(formatMoney(123456)).toBe('$1,234.56');
		expect(shopCurrency()).toBe('USD');
	});

	it('switching settings to EUR and de-DE changes every amount, with no code change', () => {
		useShopFormat({ timeZone: 'Europe/Berlin', locale: 'de-DE', currency: 'EUR' });
		expect(formatMoney(123456)).toBe('1.234,56\u00a0€');
		expect(shopCurrency()).toBe('EUR');
		// An amount taken in its own currency keeps it, written the German way.
		expect(formatMoney(4850, 'USD')).toBe('48,50\u00a0$');
		expect(formatRate(725)).toBe('7,25\u00a0%');
		// A German owner types a decimal comma; both read back the same.
		expect(parseMajor('48,50')).toBe(4850);
		expect(parseMajor('48.50')).toBe(4850);
	});

	it('yen have no minor unit (ISO 4217: JPY 0 digits)', () => {
		useShopFormat({ timeZone: 'Asia/Tokyo', locale: 'ja-JP', currency: 'JPY' });
		expect(formatMoney(1500)).toBe('￥1,500');
		expect(majorText(1500)).toBe('1500');
		expect(parseMajor('1500')).toBe(1500);
		expect(parseMajor('15,5')).toBeNull();
	});

	it('refuses grouped amounts rather than guessing which mark is the decimal', () => {
		// "1,250" is 1250 in the US and 1.25 in Germany (CLDR): three decimals is not an amount.
		expect(parseMajor('1,250')).toBeNull();
		expect(parseMajor('1.250,00')).toBeNull();
		expect(parseMajor('12.5')).toBe(1250);
	});
});

describe('one way in and out of a form box', () => {
	it('majorText and parseMajor round-trip every amount (property)', () => {
		fc.assert(
			fc.property(
				fc.integer({ min: 0, max: 10 ** 12 }),
				fc.constantFrom('USD', 'EUR', 'JPY', 'KWD'),
				(m, c) => {
					expect(parseMajor(majorText(m, c), c)).toBe(m);
				}
			)
		);
	});

	it('writes signs and zero padding as a spreadsheet reads them', () => {
		expect(majorText(5)).toBe('0.05');
		expect(majorText(-300)).toBe('-3.00');
		expect(majorText(1234, 'KWD')).toBe('1.234'); // ISO 4217: KWD has 3 digits
		expect(toMajor(1999)).toBe(19.99);
		expect(percentText(725)).toBe('7.25');
		expect(percentText(50)).toBe('0.50');
	});

	it('piece prices, fair amounts and fair form values use it', () => {
		useShopFormat({ timeZone: 'Europe/Berlin', locale: 'de-DE', currency: 'EUR' });
		expect(priceMinor.parse('48,50')).toBe(4850);
		expect(priceMinor.safeParse('48,505').success).toBe(false);
		expect(priceMinor.safeParse('0.50').success).toBe(false); // at least 1.00
		expect(moneyField('the booth fee').parse('120,5')).toBe(12050);
		const v = fairFormValues({
			name: 'x',
			place: 'y',
			startsOn: '2026-06-01',
			endsOn: '2026-06-01',
			boothFeeMinor: 6000,
			otherCostsMinor: 1505,
			salesTaxBp: 725,
			pricesIncludeTax: false,
			cashFloatMinor: 10000,
			cardFeeBp: 260,
			helperDiscountBp: 1000,
			openMinutes: 480,
			notes: null
		});
		expect([v.boothFee, v.otherCosts, v.cashFloat, v.salesTax, v.cardFee]).toEqual([
			'60.00',
			'15.05',
			'100.00',
			'7.25',
			'2.60'
		]);
	});
});
