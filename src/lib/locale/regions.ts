import { iso31662 } from 'iso-3166/2.js';
import { COUNTRIES } from './countries';

/**
 * States, provinces and other subdivisions of the countries we post to, from ISO 3166-2 (the
 * `iso-3166` package's list). A buyer may type a region by its name ("Vermont", "Łódzkie",
 * "Tokyo") or its code ("VT", "us-vt"); accents and case do not matter.
 */
export type Region = { code: string; name: string };

/** Countries whose postal addresses need the region, and write it as its code (VT, ON, NSW). */
export const REGION_REQUIRED = ['US', 'CA', 'AU'] as const;
/** An example of each, for the sentence that asks for one. */
export const REGION_EXAMPLE: Record<(typeof REGION_REQUIRED)[number], string> = {
	US: 'Vermont or VT',
	CA: 'Ontario or ON',
	AU: 'New South Wales or NSW'
};
const WORD: Record<(typeof REGION_REQUIRED)[number], string> = {
	US: 'state',
	CA: 'province or territory',
	AU: 'state or territory'
};

export function regionRequired(country: string): country is (typeof REGION_REQUIRED)[number] {
	return (REGION_REQUIRED as readonly string[]).includes(country);
}

/**
 * The region as an address keeps it, or the sentence that says what is wrong: required and
 * checked where the post needs it, kept as typed (or as the list names it) elsewhere.
 */
export function checkRegion(
	country: string,
	typed: string | undefined
): { ok: true; region: string | undefined } | { ok: false; message: string } {
	const text = (typed ?? '').trim();
	const found = text ? findRegion(country, text) : null;
	if (regionRequired(country)) {
		if (!text)
			return {
				ok: false,
				message: `Enter the ${WORD[country]}, by name or code, like ${REGION_EXAMPLE[country]}.`
			};
		if (!found)
			return {
				ok: false,
				message: `We do not know “${text}” as a ${WORD[country]} there: type its name or code, like ${REGION_EXAMPLE[country]}.`
			};
	}
	if (!text) return { ok: true, region: undefined };
	return { ok: true, region: found ? regionForAddress(country, found) : text };
}

/** Letters that Unicode does not split into a base letter and a mark (Ł is not L + stroke). */
const LONE: Record<string, string> = { ł: 'l', ø: 'o', đ: 'd', ß: 'ss', æ: 'ae', œ: 'oe' };

const fold = (s: string) =>
	s
		.toLowerCase()
		.replace(/[łøđßæœ]/g, (c) => LONE[c])
		.normalize('NFD')
		.replace(/\p{M}/gu, '')
		.replace(/[^\p{L}\p{N}]+/gu, ' ')
		.trim()
		.toLowerCase();

const byCountry = new Map<string, Region[]>();
for (const c of COUNTRIES) byCountry.set(c, []);
for (const e of iso31662) {
	const country = e.code.slice(0, 2);
	byCountry.get(country)?.push({ code: e.code.slice(3), name: e.name });
}
for (const list of byCountry.values()) list.sort((a, b) => a.name.localeCompare(b.name));

/** The country's regions by name, or an empty list when we have none for it. */
export function regionsFor(country: string): Region[] {
	return byCountry.get(country.toUpperCase()) ?? [];
}

/** The region the buyer meant, by code or name; null when it is none of the country's. */
export function findRegion(country: string, typed: string): Region | null {
	const list = regionsFor(country);
	const t = fold(typed);
	if (!t) return null;
	const code = t.replace(new RegExp(`^${country.toLowerCase()} `), '').replace(/ /g, '');
	return (
		list.find((r) => r.code.toLowerCase() === code) ?? list.find((r) => fold(r.name) === t) ?? null
	);
}

/** What an address keeps: the code where the post writes codes, else the region's name. */
export function regionForAddress(country: string, region: Region): string {
	return regionRequired(country) ? region.code : region.name;
}
