import Flatten from '@flatten-js/core';
import { describe, expect, it } from 'vitest';
import { computePattern } from '$lib/pattern';
import { letterFont } from '$lib/pattern/letter-font';

const { point, circle, Polygon, BooleanOperations } = Flatten;

/** Area of the union of the rosette discs, computed by flatten-js's boolean operations. */
function unionArea(discs: { x: number; y: number; r: number }[]): number {
	let u = new Polygon(circle(point(discs[0].x, discs[0].y), discs[0].r));
	for (const d of discs.slice(1))
		u = BooleanOperations.unify(u, new Polygon(circle(point(d.x, d.y), d.r)));
	return u.area();
}

const cases = [
	{ name: 'three spaced by the radius', diameterMm: 70, count: 3, spacingMm: undefined },
	{ name: 'two at an odd spacing', diameterMm: 60, count: 2, spacingMm: 20 },
	{ name: 'four at 0.8 of the diameter', diameterMm: 50, count: 4, spacingMm: 40 },
	{ name: 'two just touching', diameterMm: 50, count: 2, spacingMm: 50 },
	{ name: 'two apart', diameterMm: 40, count: 2, spacingMm: 55 }
];

describe('overlapping rosettes: chips are the faces of one arrangement', () => {
	for (const c of cases) {
		for (const split of [false, true]) {
			it(`${c.name}${split ? ', halved' : ''}: chip areas add up to the union of the discs`, () => {
				const res = computePattern(
					{
						diameterMm: c.diameterMm,
						count: c.count,
						spacingMm: c.spacingMm,
						split,
						widthMm: 120,
						lengthMm: 400
					},
					{ svg: false }
				);
				const total = res.chips.reduce((s, k) => s + k.areaMm2, 0);
				const ref = unionArea(res.rosettes); // flatten-js BooleanOperations.unify
				expect(Math.abs(total - ref) / ref).toBeLessThan(1e-9);
				for (const k of res.chips) expect(k.areaMm2).toBeGreaterThan(0);
				// No double counting: where discs overlap, the sum over separate rosettes would exceed the union.
				const separate = res.rosettes.reduce((s, d) => s + Math.PI * d.r * d.r, 0);
				if (c.spacingMm === undefined || c.spacingMm < c.diameterMm)
					expect(total).toBeLessThan(separate - 1);
			});
		}
	}

	it('at spacing r the neighbours share chips: each shared petal is counted once', () => {
		const r = 35;
		const res = computePattern(
			{ diameterMm: 70, count: 3, widthMm: 100, lengthMm: 300 },
			{ svg: false }
		);
		const petalArea = r * r * (Math.PI / 3 - Math.sqrt(3) / 2); // MathWorld lens formula with d = r√3
		const petals = res.chips.filter((k) => k.kind === 'petal');
		for (const p of petals) expect(p.areaMm2).toBeCloseTo(petalArea, 8);
		// Issue 4: at spacing r each neighbour's centre is a petal tip of the one before.
		const [a, b] = res.rosettes;
		expect(Math.abs(b.y - a.y - r)).toBeLessThan(1e-9);
		expect(Math.abs(b.x - a.x)).toBeLessThan(1e-9);
		// 3 × 12 chips drawn separately, but the arrangement has fewer: shared ones counted once.
		expect(res.chipCount).toBeLessThan(36);
	});

	it('the medallion takes its disc out of the chips and nothing else', () => {
		const font = letterFont();
		const res = computePattern(
			{ diameterMm: 70, count: 3, initials: 'ABC', widthMm: 100, lengthMm: 300 },
			{ font, svg: false }
		);
		const m = res.drawing.lettering!.medallion;
		const chipArea = res.chips
			.filter((k) => k.kind !== 'letter')
			.reduce((s, k) => s + k.areaMm2, 0);
		// Union of discs (flatten-js) less the medallion disc (πρ²).
		expect(chipArea).toBeCloseTo(unionArea(res.rosettes) - Math.PI * m.r * m.r, 6);
	});
});
