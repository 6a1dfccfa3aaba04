/**
 * Regions typed by name or code. The codes checked here are ISO 3166-2's own (ISO 3166-2:US
 * US-VT Vermont, ISO 3166-2:CA CA-ON Ontario, ISO 3166-2:AU AU-NSW New South Wales, ISO 3166-2:PL
 * PL-10 Łódzkie, ISO 3166-2:JP JP-13 Tōkyō), and the US Postal Service's state abbreviations
 * (USPS Publication 28, appendix B) are the same two letters: that is why an address keeps the
 * code for US, CA and AU.
 */
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { checkRegion, findRegion, regionsFor } from '$lib/locale/regions';
import { checkoutSchema } from '$lib/cart/checkout-schema';
import { COUNTRIES } from '$lib/locale/countries';

const address = {
	name: 'Ada Linden',
	email: 'ada@example.test',
	line1: '4 Mill Lane',
	city: 'Burlington',
	postcode: '05401',
	country: 'US'
};

describe('the list per country (ISO 3166-2)', () => {
	it('has the 50 US states and DC among its US entries', () => {
		const us = regionsFor('US');
		// ISO 3166-2:US: 50 states, 1 district, 6 outlying areas.
		expect(us).toHaveLength(57);
		expect(us).toContainEqual({ code: 'VT', name: 'Vermont' });
		expect(us).toContainEqual({ code: 'DC', name: 'District of Columbia' });
	});
	it('has Canada’s 13 provinces and territories and Australia’s 8 states and territories', () => {
		expect(regionsFor('CA')).toHaveLength(13);
		expect(regionsFor('AU')).toHaveLength(8);
	});
	it('has a list for the ship-to countries that ISO divides', () => {
		for (const c of COUNTRIES) expect(regionsFor(c).length, c).toBeGreaterThan(0);
	});
});

describe('a region by name or by code', () => {
	it.each([
		['US', 'Vermont', 'VT'],
		['US', 'vermont', 'VT'],
		['US', 'VT', 'VT'],
		['US', 'us-vt', 'VT'],
		['US', ' New   York ', 'NY'],
		['CA', 'Québec', 'QC'],
		['CA', 'Quebec', 'QC'],
		['AU', 'new south wales', 'NSW'],
		['PL', 'Łódzkie', '10'],
		['PL', 'lodzkie', '10'],
		['JP', 'Tokyo', '13'],
		['CZ', 'Praha, Hlavní město', '10']
	])('%s “%s” is %s', (country, typed, code) => {
		expect(findRegion(country, typed)?.code).toBe(code);
	});
	it('refuses what is no region of the country', () => {
		expect(findRegion('US', 'Vermontt')).toBeNull();
		expect(findRegion('US', 'ON')).toBeNull();
		expect(findRegion('US', '')).toBeNull();
	});
});

describe('the checkout form', () => {
	const regionOf = (input: Record<string, string>) => {
		const r = checkoutSchema.safeParse({ ...address, ...input });
		return r.success ? { region: r.data.region } : z.flattenError(r.error).fieldErrors;
	};
	it('keeps the two-letter code whether the buyer typed “Vermont” or “VT”', () => {
		expect(regionOf({ region: 'Vermont' })).toEqual({ region: 'VT' });
		expect(regionOf({ region: 'vt' })).toEqual({ region: 'VT' });
	});
	it('asks for a US state, and says which one it does not know', () => {
		expect(regionOf({ region: '' })).toEqual({
			region: ['Enter the state, by name or code, like Vermont or VT.']
		});
		expect(regionOf({ region: 'Vermontt' })).toEqual({
			region: [
				'We do not know “Vermontt” as a state there: type its name or code, like Vermont or VT.'
			]
		});
	});
	it('takes a Polish voivodeship by name and leaves the region optional there', () => {
		const pl = { country: 'PL', city: 'Łódź', postcode: '90-001' };
		expect(regionOf({ ...pl, region: 'lodzkie' })).toEqual({ region: 'Łódzkie' });
		expect(regionOf({ ...pl, region: '' })).toEqual({ region: undefined });
		// Not on ISO's list but a real way to write it: kept as typed rather than refused.
		expect(regionOf({ ...pl, region: 'Województwo łódzkie' })).toEqual({
			region: 'Województwo łódzkie'
		});
	});
	it('checks the region even when another field is wrong, so both messages show at once', () => {
		const r = checkoutSchema.safeParse({ ...address, postcode: 'x', region: 'Nowhere' });
		expect(r.success).toBe(false);
		const errors = z.flattenError(r.error!).fieldErrors as Record<string, string[]>;
		expect(Object.keys(errors).sort()).toEqual(['postcode', 'region']);
	});
	it('answers plainly for an empty region (check of checkRegion itself)', () => {
		expect(checkRegion('CA', '')).toEqual({
			ok: false,
			message: 'Enter the province or territory, by name or code, like Ontario or ON.'
		});
	});
});
