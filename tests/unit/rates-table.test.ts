/**
 * The shipping-rate table in settings: rows as typed come back as bands, spare empty rows are
 * dropped, a bad row is named by its number and zone, and every zone needs a band. Prices are
 * read in the currency's major units (8.95 → 895 minor units, as ISO 4217 gives USD two digits).
 */
import { describe, expect, it } from 'vitest';
import { rateLine } from '$lib/settings/settings-schema';
import { parseRateInputs, rateInputs, rateInputsFromForm } from '$lib/settings/rates-table';

const form = (rows: [string, string, string][]) => {
	const f = new FormData();
	for (const [zone, g, price] of rows) {
		f.append('zone', zone);
		f.append('upToGrams', g);
		f.append('price', price);
	}
	return f;
};

describe('shipping rate table', () => {
	it('reads rows by index, drops empty ones and keeps every zone', () => {
		const typed = rateInputsFromForm(
			form([
				['domestic', '500', '8.95'],
				['domestic', '', ''],
				['north_america', '1000', '18.95'],
				['world', '2000', '32.00']
			])
		);
		const parsed = parseRateInputs(typed, rateLine);
		expect(parsed).toEqual({
			ok: true,
			rows: [
				{ zone: 'domestic', upToGrams: 500, priceMinor: 895 },
				{ zone: 'north_america', upToGrams: 1000, priceMinor: 1895 },
				{ zone: 'world', upToGrams: 2000, priceMinor: 3200 }
			]
		});
	});

	it('names the bad row and its zone, and asks for a missing zone by name', () => {
		const bad = parseRateInputs(
			rateInputsFromForm(
				form([
					['domestic', '500', '8.95'],
					['world', 'heavy', '9']
				])
			),
			rateLine
		);
		expect(bad).toMatchObject({ ok: false, row: 1 });
		expect(!bad.ok && bad.error).toMatch(/^Row 2 \(Rest of the world\): Weight/);
		const dup = parseRateInputs(
			rateInputsFromForm(
				form([
					['domestic', '500', '8.95'],
					['domestic', '500', '9.95']
				])
			),
			rateLine
		);
		expect(!dup.ok && dup.error).toMatch(/already listed/);
		const missing = parseRateInputs(
			rateInputsFromForm(form([['domestic', '500', '8.95']])),
			rateLine
		);
		expect(!missing.ok && missing.error).toBe(
			'Add at least one band for Rest of North America, Rest of the world.'
		);
	});

	it('shows stored bands zone by zone, lightest first, with two-digit prices', () => {
		expect(
			rateInputs([
				{ zone: 'world', upToGrams: 500, priceMinor: 2500 },
				{ zone: 'domestic', upToGrams: 2000, priceMinor: 1200 },
				{ zone: 'domestic', upToGrams: 500, priceMinor: 895 }
			]).map((r) => `${r.zone} ${r.upToGrams} ${r.price}`)
		).toEqual(['domestic 500 8.95', 'domestic 2000 12.00', 'world 500 25.00']);
	});
});
