/**
 * The region an order keeps. Expected spellings are ISO 3166-2's own: ISO 3166-2:JP JP-13 "Tôkyô"
 * (the standard's romanisation of 東京都), ISO 3166-2:PL PL-10 "Łódzkie", ISO 3166-2:US US-VT
 * Vermont, whose code is also the US Postal Service's abbreviation (USPS Publication 28, app. B).
 */
import { describe, expect, it } from 'vitest';
import { checkoutSchema } from '$lib/cart/checkout-schema';
import { addressOf } from '$lib/server/orders/address';

const buyer = (country: string, region: string, postcode: string) =>
	checkoutSchema.parse({
		name: 'Ada Linden',
		email: 'ada@example.test',
		line1: '4 Mill Lane',
		city: 'Town',
		region,
		postcode,
		country
	});

describe('the region an order keeps', () => {
	it.each([
		['JP', 'Tokyo', '100-0001', 'Tôkyô'],
		['JP', 'tôkyô', '100-0001', 'Tôkyô'],
		// Typed in kanji: not in the romanised list, so kept exactly as typed.
		['JP', '東京都', '100-0001', '東京都'],
		['PL', 'Łódzkie', '90-001', 'Łódzkie'],
		['PL', 'lodzkie', '90-001', 'Łódzkie'],
		['US', 'Vermont', '05401', 'VT'],
		['US', 'vt', '05401', 'VT']
	])('%s “%s” is stored as “%s”', (country, typed, postcode, stored) => {
		expect(addressOf(buyer(country, typed, postcode)).region).toBe(stored);
	});

	it('is never uppercased where the name is not a code', () => {
		const a = addressOf(buyer('JP', 'Tokyo', '100-0001'));
		expect(a.region).not.toBe('TÔKYÔ');
	});

	it('keeps a region unknown to the list as typed, and leaves out an empty one', () => {
		expect(addressOf(buyer('GB', 'Somewhere Shire', 'SW1A 1AA')).region).toBe('Somewhere Shire');
		expect('region' in addressOf(buyer('GB', '', 'SW1A 1AA'))).toBe(false);
	});
});
