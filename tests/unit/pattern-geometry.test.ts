import Flatten from '@flatten-js/core';
import { describe, expect, it } from 'vitest';
import { computePattern } from '$lib/pattern';
import { lensArea } from '$lib/pattern/geometry';
import { rosetteAt, stepRound } from '$lib/pattern/rosette';

const { point, circle, arc } = Flatten;
const one = (diameterMm: number, split = false) =>
	computePattern(
		{ diameterMm, count: 1, split, widthMm: diameterMm + 40, lengthMm: diameterMm + 40 },
		{ svg: false }
	);

describe('six-petal rosette geometry', () => {
	it('steps the radius six times round and closes (Euclid, Elements IV.15)', () => {
		for (const [x, y, r] of [
			[0, 0, 1],
			[50, 150, 35],
			[12.5, -7.25, 123.456]
		]) {
			const c = { x, y, r };
			const marks = stepRound(c, { x, y: y - r });
			// Euclid, Elements, Book IV, Prop. 15: the side of the inscribed hexagon equals the radius,
			// so six steps of the compass close the circle exactly.
			expect(Math.hypot(marks[6].x - marks[0].x, marks[6].y - marks[0].y)).toBeLessThan(1e-9);
			for (let k = 0; k < 6; k++) {
				expect(
					Math.abs(Math.hypot(marks[k + 1].x - marks[k].x, marks[k + 1].y - marks[k].y) - r)
				).toBeLessThan(1e-9);
				expect(Math.abs(Math.hypot(marks[k].x - x, marks[k].y - y) - r)).toBeLessThan(1e-9);
			}
		}
	});

	it('lens formula gives the published check value', () => {
		// Weisstein, MathWorld "Circle-Circle Intersection" / "Lens"; check value in TRADE.md:
		// A(d = 1, r = 1) = 2π/3 − √3/2 = 1.2283696986.
		expect(lensArea(1, 1)).toBeCloseTo(1.2283696986, 10);
	});

	it('has six petals of area r²(π/3 − √3/2) and six between-petal chips filling the disc', () => {
		for (const d of [40, 70, 151]) {
			const r = d / 2;
			const res = one(d);
			const petals = res.chips.filter((c) => c.kind === 'petal');
			const between = res.chips.filter((c) => c.kind === 'between');
			expect(petals).toHaveLength(6);
			expect(between).toHaveLength(6);
			// Petal = lens of two radius-r circles with centres r√3 apart (MathWorld lens formula):
			// r²(π/3 − √3/2).
			for (const p of petals)
				expect(p.areaMm2).toBeCloseTo(r * r * (Math.PI / 3 - Math.sqrt(3) / 2), 8);
			// Between-petal chip r²(3√3 − π)/6 (TRADE.md, derived from the lens formula).
			for (const b of between)
				expect(b.areaMm2).toBeCloseTo((r * r * (3 * Math.sqrt(3) - Math.PI)) / 6, 8);
			// 6 petals + 6 between = the disc, πr² (area of a circle).
			const total = res.chips.reduce((s, c) => s + c.areaMm2, 0);
			expect(total).toBeCloseTo(Math.PI * r * r, 8);
		}
	});

	it('draws each petal edge as a 60° arc, πr/3 long', () => {
		const r = 35;
		const res = one(70);
		for (const chip of res.drawing.chips.filter((c) => c.kind === 'petal')) {
			expect(chip.edges).toHaveLength(2);
			for (const e of chip.edges) {
				expect(e.kind).toBe('arc');
				// A 60° arc of radius r is πr/3 long (TRADE.md, derived: arc length = r·θ).
				if (e.kind === 'arc') expect(Math.abs(e.sweep) * e.c.r).toBeCloseTo((Math.PI * r) / 3, 9);
			}
			expect(chip.cutLengthMm).toBeCloseTo((2 * Math.PI * r) / 3, 9);
		}
	});

	it('halved chips give 24 chips of half the size (common practice)', () => {
		const r = 35;
		const res = one(70, true);
		// Issue 4 / common practice: each of the 12 chips split along its axis → 24 chips.
		expect(res.chipCount).toBe(24);
		const halfPetal = (r * r * (Math.PI / 3 - Math.sqrt(3) / 2)) / 2;
		const halves = res.chips.filter((c) => c.kind === 'half-petal');
		expect(halves).toHaveLength(12);
		for (const h of halves) expect(h.areaMm2).toBeCloseTo(halfPetal, 8); // MathWorld lens formula, halved
		expect(res.chips.reduce((s, c) => s + c.areaMm2, 0)).toBeCloseTo(Math.PI * r * r, 8);
	});
});

describe('agreement with @flatten-js/core (independent geometry library)', () => {
	it('finds the same arc–circle crossings as flatten-js', () => {
		const g = rosetteAt(50, 150, 35);
		const outline = circle(point(50, 150), 35);
		for (let k = 0; k < 6; k++) {
			const m = g.marks[k];
			// flatten-js computes where the arc's circle meets the outline; our marks k±1 must be those points.
			const hits = circle(point(m.x, m.y), 35).intersect(outline);
			expect(hits).toHaveLength(2);
			for (const nb of [g.marks[(k + 1) % 6], g.marks[(k + 5) % 6]]) {
				const nearest = Math.min(...hits.map((h) => Math.hypot(h.x - nb.x, h.y - nb.y)));
				expect(nearest).toBeLessThan(1e-9);
			}
		}
	});

	it('gives the same arc lengths as flatten-js for every drawn edge', () => {
		const res = computePattern(
			{ diameterMm: 64, count: 2, spacingMm: 23, widthMm: 120, lengthMm: 200 },
			{ svg: false }
		);
		let checked = 0;
		for (const chip of res.drawing.chips) {
			for (const e of chip.edges) {
				if (e.kind !== 'arc') continue;
				const a0 = Math.atan2(e.from.y - e.c.y, e.from.x - e.c.x);
				const a1 = Math.atan2(e.to.y - e.c.y, e.to.x - e.c.x);
				// flatten-js measures the arc between our end points on the same circle, going the same way.
				const ref = arc(point(e.c.x, e.c.y), e.c.r, a0, a1, e.sweep > 0);
				expect(Math.abs(ref.length - Math.abs(e.sweep) * e.c.r)).toBeLessThan(1e-6);
				checked++;
			}
		}
		expect(checked).toBeGreaterThan(40);
	});
});
