/**
 * The shop's own clock, language, money and words: shop-wide settings (never per visitor), held
 * once per process. The server loads them at start and again when the owner saves them
 * (`$lib/server/settings/shop-settings`); the browser gets the same values from the root layout's data.
 * `$lib/locale/dates` and `$lib/locale/money` read them here, so their callers never pass a zone or a locale.
 */

export type ShopFormat = {
	/** IANA time zone name, e.g. America/New_York: every "today", day and hour is counted here. */
	timeZone: string;
	/** BCP 47 language tag for dates and amounts, e.g. en-US or de-DE. */
	locale: string;
	/** ISO 4217 code the owner prices pieces, rates and fairs in. */
	currency: string;
};

export type ShopWords = {
	/** The carver's name as buyers know it ("We" is said when empty). */
	owner: string;
	/** The workshop's town ("our workshop" when empty). */
	town: string;
	/** The last line of every e-mail the shop sends; nothing when empty. */
	signOff: string;
};

export const DEFAULT_FORMAT: ShopFormat = { timeZone: 'UTC', locale: 'en-US', currency: 'USD' };
export const DEFAULT_WORDS: ShopWords = { owner: '', town: '', signOff: '' };

let format: ShopFormat = DEFAULT_FORMAT;
let words: ShopWords = DEFAULT_WORDS;

export const shopFormat = (): ShopFormat => format;
export const shopWords = (): ShopWords => words;

export function useShopFormat(f: ShopFormat) {
	format = f;
}
export function useShopWords(w: ShopWords) {
	words = w;
}

/** The owner's name, or "We": who does the work, at the start of a sentence. */
export function carverSubject(w: ShopWords = words): string {
	return w.owner.trim() || 'We';
}
/** The owner's name, or "us": who does the work, after a verb. */
export function carverObject(w: ShopWords = words): string {
	return w.owner.trim() || 'us';
}
/** "our workshop in <town>", or "our workshop" when no town is set. */
export function workshopWords(w: ShopWords = words): string {
	return w.town.trim() ? `our workshop in ${w.town.trim()}` : 'our workshop';
}
