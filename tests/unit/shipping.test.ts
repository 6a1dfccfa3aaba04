import { describe, expect, it } from 'vitest';
import { densityAt12 } from '$lib/catalogue/woods';
import {
	billableGrams,
	dimWeightKg,
	dimWeightLb,
	packedGrams,
	PACKAGING,
	rateFor,
	woodGrams,
	zoneFor
} from '$lib/catalogue/shipping';

describe('weight from the Wood Handbook density', () => {
	// Wood Handbook (FPL-GTR-190, Table 5-3a; FPL-GTR-282, Table 5-3b): specific gravity at 12 % MC;
	// ρ = 1000·G·(1 + 0.12) kg/m³ (the handbook's relation). One litre = 0.001 m³.
	it.each([
		['basswood, American', 0.37, 414],
		['cherry, black', 0.5, 560],
		['walnut, black', 0.55, 616],
		['maple, sugar', 0.63, 706]
	])('%s: G %f → %i kg/m³, a litre weighs that many grams', (_name, g, rho) => {
		expect(densityAt12(g)).toBe(rho);
		expect(woodGrams(1_000_000, densityAt12(g))).toBeCloseTo(rho, 6);
	});

	it('adds packaging to a board’s wood weight', () => {
		// 300 × 200 × 20 mm basswood board = 0.0012 m³ × 414 kg/m³ = 0.4968 kg (Table 5-3a density).
		const grams = packedGrams({ kind: 'board', lengthMm: 300, widthMm: 200, thicknessMm: 20 }, 414);
		expect(grams).toBe(Math.ceil(496.8 + PACKAGING.grams));
	});
});

describe('dimensional weight', () => {
	it('UPS/FedEx daily rates: 139 in³/lb, up to the whole pound', () => {
		// Carriers' rate guides (as recalled): 12 × 10 × 5 in / 139 = 4.3165 → 5 lb.
		expect((12 * 10 * 5) / 139).toBeCloseTo(4.3165, 4);
		expect(dimWeightLb(12, 10, 5)).toBe(5);
		// Dimensions round to the nearest inch first: 11.6 × 10.4 × 4.5 → 12 × 10 × 5 (as recalled).
		expect(dimWeightLb(11.6, 10.4, 4.5)).toBe(5);
	});

	it('DHL Express: 5000 cm³/kg', () => {
		// DHL Express volumetric weight (as recalled): 30 × 20 × 15 cm / 5000 = 1.8 kg.
		expect(dimWeightKg(30, 20, 15)).toBeCloseTo(1.8, 10);
	});

	it('bills the greater of actual and dimensional weight', () => {
		// A light, bulky plate: 250 mm disc, 20 mm thick, basswood → box 300 × 300 × 70 mm
		// ≈ 12 × 12 × 3 in = 432 in³ / 139 = 3.1 → 4 lb dimensional, far above ~0.6 kg actual.
		const plate = { kind: 'plate', lengthMm: 250, widthMm: 250, thicknessMm: 20 };
		const r = billableGrams([{ size: plate, densityKgM3: 414, quantity: 1 }]);
		expect(r.actualGrams).toBeLessThan(700);
		expect(r.billable).toBe(Math.round(4 * 453.59237)); // 1 lb = 453.59237 g exactly (1959 agreement)
		// A dense, compact piece: actual weight wins.
		const block = { kind: 'board', lengthMm: 200, widthMm: 150, thicknessMm: 60 };
		const b = billableGrams([{ size: block, densityKgM3: 706, quantity: 1 }]);
		expect(b.billable).toBeGreaterThanOrEqual(b.actualGrams);
		expect(b.billable).toBe(Math.round(Math.ceil(b.actualGrams / 453.59237) * 453.59237));
	});
});

describe('rate table', () => {
	const rates = [
		{ zone: 'domestic', upToGrams: 1000, priceMinor: 900 },
		{ zone: 'domestic', upToGrams: 3000, priceMinor: 1400 },
		{ zone: 'world', upToGrams: 3000, priceMinor: 3500 }
	];
	it('picks the zone by country and the first band that covers the weight', () => {
		expect(zoneFor('us')).toBe('domestic');
		expect(zoneFor('CA')).toBe('north_america');
		expect(zoneFor('DE')).toBe('world');
		expect(rateFor(rates, 'domestic', 1000)).toBe(900);
		expect(rateFor(rates, 'domestic', 1001)).toBe(1400);
		expect(rateFor(rates, 'domestic', 5000)).toBeNull();
		expect(rateFor(rates, 'north_america', 100)).toBeNull();
	});
});
