import { describe, expect, it } from 'vitest';
import { buyableWoods, fromPriceMinor } from '$lib/catalogue/from-price';

// The demo's wood add-ons (scripts/seed/data/woods.ts): cherry $8, maple $10, walnut $12.
const cherry = { priceAddOnMinor: 800, inStock: 3 };
const maple = { priceAddOnMinor: 1000, inStock: 2 };
const walnut = { priceAddOnMinor: 1200, inStock: 0 };

describe('fromPriceMinor', () => {
	it('is the base price plus the cheapest wood, never the bare base price', () => {
		// Worked by hand: a $24.00 scoop in cherry (+$8.00) or maple (+$10.00) costs at least $32.00.
		expect(fromPriceMinor({ basePriceMinor: 2400, personalisable: false }, [cherry, maple])).toBe(
			3200
		);
		// Worked by hand: a $72.00 plate in cherry, maple or walnut starts at $80.00.
		expect(
			fromPriceMinor({ basePriceMinor: 7200, personalisable: true }, [cherry, maple, walnut])
		).toBe(8000);
	});

	it('skips a wood a plain piece has none of, since only finished stock can be bought', () => {
		const soldOutCherry = { ...cherry, inStock: 0 };
		// Worked by hand: with cherry gone only maple can be had, $24.00 + $10.00.
		expect(
			fromPriceMinor({ basePriceMinor: 2400, personalisable: false }, [soldOutCherry, maple])
		).toBe(3400);
		expect(buyableWoods(false, [soldOutCherry, maple])).toEqual([maple]);
	});

	it('keeps every offered wood for a piece carved to order, stock or not', () => {
		// A personalised piece is carved in any offered wood (common practice for made-to-order work).
		expect(buyableWoods(true, [walnut, cherry])).toEqual([walnut, cherry]);
		expect(fromPriceMinor({ basePriceMinor: 1400, personalisable: true }, [walnut])).toBe(2600);
	});

	it('falls back to the offered woods when a plain piece is sold out everywhere', () => {
		const none = [
			{ ...cherry, inStock: 0 },
			{ ...maple, inStock: 0 }
		];
		expect(fromPriceMinor({ basePriceMinor: 2400, personalisable: false }, none)).toBe(3200);
		expect(fromPriceMinor({ basePriceMinor: 2400, personalisable: false }, [])).toBe(2400);
	});
});
