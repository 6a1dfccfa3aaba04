import { z } from 'zod';
import { ZONES } from '$lib/catalogue/shipping';
import { priceMinor } from '../catalogue/piece-schema';
import { isTimeZone } from '$lib/locale/dates';
import { MINOR_DIGITS, parsePercent } from '$lib/locale/money';
import { DEFAULT_TAX_BASIS, TAX_BASES } from '$lib/tax/sales-tax';

const line = (label: string, maxLen = 120) =>
	z.string().trim().min(1, `${label} is needed.`).max(maxLen);

/** The shop's return address: printed on every slip and shown in the footer and on /contact. */
export const returnAddress = z.object({
	name: line('A name for the address'),
	line1: line('The street line'),
	line2: z.string().trim().max(120),
	city: line('The town'),
	region: z.string().trim().max(60),
	postcode: line('The postcode', 20),
	country: z
		.string()
		.trim()
		.toUpperCase()
		.regex(/^[A-Z]{2}$/, 'Two letters, e.g. US.')
});
export type ReturnAddress = z.infer<typeof returnAddress>;

export const shopInfo = z.object({
	name: line('The shop name', 80),
	email: z.email('Type an e-mail address buyers can write to.').max(255),
	address: returnAddress
});
export type ShopInfo = z.infer<typeof shopInfo>;

/** Closed dates: "away until …" shows in the shop; empty `until` means open. */
export const away = z
	.object({
		until: z.union([z.literal(''), z.iso.date('Pick the day you are back.')]),
		note: z.string().trim().max(300, 'Keep the note under 300 characters.')
	})
	.refine((a) => a.until !== '' || a.note === '', {
		path: ['until'],
		message: 'Say until when you are away, or clear the note.'
	});
export type Away = z.infer<typeof away>;

export const policies = z.object({
	returnsDays: z.coerce
		.number({ error: 'Type a number of days.' })
		.int('Type a whole number of days.')
		.min(0)
		.max(365),
	extra: z.string().trim().max(2000, 'Keep it under 2000 characters.')
});
export type Policies = z.infer<typeof policies>;

/** One band per line, "zone up-to-grams price", e.g. "domestic 500 8.95". */
export const rateLine = z.object({
	zone: z.enum(ZONES, { error: `Zone is one of ${ZONES.join(', ')}.` }),
	upToGrams: z.coerce
		.number({ error: 'Weight: grams as a whole number.' })
		.int('Weight: grams as a whole number.')
		.min(1)
		.max(70_000, 'Weight: at most 70 000 g.'),
	priceMinor
});
export type RateLine = z.infer<typeof rateLine>;

/**
 * A sales-tax rate typed as a percentage with up to two decimals, read as basis points
 * ("7.25" → 725, "7,25" too where the shop writes a decimal comma, "0" for none).
 */
export const percentBp = z
	.string({ error: 'Type a percentage like 7.25, or 0 for none.' })
	.trim()
	.regex(/^\d{1,2}([.,]\d{1,2})?$/, 'Type a percentage like 7.25, or 0 for none.')
	.transform((s) => parsePercent(s) ?? -1)
	.pipe(
		z.number().int().min(0).max(2500, 'That is higher than any sales tax we know of; check it.')
	);

/** Settings → Sales tax on online orders: the rate as typed and how it is worked out. */
export const salesTaxForm = z.object({
	rate: percentBp,
	basis: z.enum(TAX_BASES, {
		error: 'Choose whether tax is worked out on each line or once on the whole order.'
	})
});

/** The online sales tax as stored; a value saved before the basis existed reads as per line. */
export const salesTaxSetting = z.object({
	rateBp: z.number().int().min(0).max(2500),
	basis: z.enum(TAX_BASES).catch(DEFAULT_TAX_BASIS)
});
export type SalesTaxSetting = z.infer<typeof salesTaxSetting>;

/** The shop's clock, language and currency (see `$lib/locale/shop-format`). */
export const shopFormat = z.object({
	timeZone: z
		.string()
		.trim()
		.refine(isTimeZone, 'Pick a time zone from the list, e.g. America/New_York.'),
	locale: z
		.string()
		.trim()
		.refine(isLocale, 'Pick a language and region from the list, e.g. en-US.'),
	currency: z
		.string()
		.trim()
		.toUpperCase()
		.refine((c) => c in MINOR_DIGITS, `Pick one of ${Object.keys(MINOR_DIGITS).join(', ')}.`)
});

/** The shop's words: who carves, where, and how e-mails end. */
export const shopWords = z.object({
	owner: z.string().trim().max(60, 'Keep the name under 60 characters.').default(''),
	town: z.string().trim().max(80, 'Keep the town under 80 characters.').default(''),
	signOff: z.string().trim().max(200, 'Keep the sign-off under 200 characters.').default('')
});

/** Locales offered in settings: each writes dates and amounts its own way. */
export const LOCALES = [
	'en-US',
	'en-CA',
	'en-GB',
	'en-AU',
	'en-NZ',
	'en-IE',
	'fr-CA',
	'fr-FR',
	'de-DE',
	'de-AT',
	'de-CH',
	'nl-NL',
	'sv-SE',
	'nb-NO',
	'da-DK',
	'fi-FI',
	'it-IT',
	'es-ES',
	'es-MX',
	'pt-PT',
	'ja-JP'
] as const;

function isLocale(tag: string): boolean {
	return (LOCALES as readonly string[]).includes(tag);
}
