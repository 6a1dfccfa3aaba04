/**
 * Money as integer minor units plus an ISO 4217 currency code. No floats ever hold an amount.
 * Writing and reading amounts only (sales tax is worked out in `$lib/tax/sales-tax`). This is
 * the one place that knows a currency's decimals and the shop's way of writing amounts (its
 * locale and currency, from `$lib/locale/shop-format`): nothing else divides by 100 or names a
 * code.
 */
import { shopFormat } from './shop-format';

/** Minor-unit digits per ISO 4217 (the "minor unit" column of the currency code list). */
export const MINOR_DIGITS: Record<string, number> = {
	USD: 2,
	EUR: 2,
	GBP: 2,
	CAD: 2,
	AUD: 2,
	CHF: 2,
	JPY: 0,
	KRW: 0,
	BHD: 3,
	KWD: 3
};

export type Money = { minor: number; currency: string };

export function minorDigits(currency: string): number {
	const digits = MINOR_DIGITS[currency.toUpperCase()];
	if (digits === undefined) throw new Error(`Unknown currency ${currency}`);
	return digits;
}

function assertMinor(minor: number) {
	if (!Number.isSafeInteger(minor))
		throw new Error(`Amount must be whole minor units, got ${minor}`);
}

/** The shop's own currency (new pieces, shipping rates and fairs are priced in it). */
export function shopCurrency(): string {
	return shopFormat().currency;
}

const moneyFormats = new Map<string, Intl.NumberFormat>();

/**
 * Shows an amount the way the shop's locale writes it, with the currency's own decimals. The
 * currency is the one the amount was taken in (an order's, a fair's); the shop's by default.
 */
export function formatMoney(
	minor: number,
	currency: string = shopFormat().currency,
	locale: string = shopFormat().locale
): string {
	assertMinor(minor);
	const digits = minorDigits(currency);
	const key = `${locale}|${currency}`;
	let f = moneyFormats.get(key);
	if (!f) {
		f = new Intl.NumberFormat(locale, {
			style: 'currency',
			currency,
			minimumFractionDigits: digits,
			maximumFractionDigits: digits
		});
		moneyFormats.set(key, f);
	}
	return f.format(toMajor(minor, currency));
}

/** Minor units as a number of major units (a chart's axis); never stored or summed. */
export function toMajor(minor: number, currency: string = shopFormat().currency): number {
	assertMinor(minor);
	return minor / 10 ** minorDigits(currency);
}

/**
 * Minor units as a plain decimal with a point and no sign or grouping ("1234.50", "-3.00"): the
 * value of a price box and a bookkeeper's CSV column. `parseMajor` reads it back.
 */
export function majorText(minor: number, currency: string = shopFormat().currency): string {
	assertMinor(minor);
	const digits = minorDigits(currency);
	const abs = String(Math.abs(minor)).padStart(digits + 1, '0');
	const whole = digits ? abs.slice(0, -digits) : abs;
	return (minor < 0 ? '-' : '') + (digits ? `${whole}.${abs.slice(-digits)}` : whole);
}

/**
 * Parses a typed major amount ("12.50", or "12,50" where the shop writes a decimal comma) into
 * minor units without float drift; null when it is not an amount in the currency's decimals.
 * Grouping separators are refused rather than guessed ("1,250" is 1.25 in one country and 1250
 * in another).
 */
export function parseMajor(text: string, currency: string = shopFormat().currency): number | null {
	const digits = minorDigits(currency);
	const m = /^\s*(\d+)(?:[.,](\d+))?\s*$/.exec(text);
	if (!m) return null;
	const frac = m[2] ?? '';
	if (frac.length > digits || (digits === 0 && m[2] !== undefined)) return null;
	return Number(m[1]) * 10 ** digits + Number(frac.padEnd(digits, '0') || '0');
}

/** Basis points as a plain percentage for a form box: 725 → "7.25". */
export function percentText(bp: number): string {
	assertMinor(bp);
	return majorText(bp, 'USD'); // two decimals, like cents: the same digits
}

/** A typed percentage ("7.25", "7,25", "7") as basis points (725); null when not one. */
export function parsePercent(text: string): number | null {
	if (!/^\s*\d{1,3}([.,]\d{1,2})?\s*$/.test(text)) return null;
	return parseMajor(text, 'USD'); // two decimals, like cents: the same digits
}

/** A rate in basis points the way the shop's locale writes a percentage: 725 → "7.25%". */
export function formatRate(bp: number, locale: string = shopFormat().locale): string {
	assertMinor(bp);
	return new Intl.NumberFormat(locale, {
		style: 'percent',
		minimumFractionDigits: 0,
		maximumFractionDigits: 2
	}).format(bp / 10_000);
}
