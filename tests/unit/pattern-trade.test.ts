import { describe, expect, it } from 'vitest';
import { computePattern } from '$lib/pattern';
import { layoutBorder, BORDER_DEFAULTS } from '$lib/pattern/borders';
import { hardnessFactor } from '$lib/pattern/effort';
import { WOODS } from '$lib/catalogue/woods';
import { letterFont } from '$lib/pattern/letter-font';

describe('trade practice', () => {
	it('a 70 mm rosette is drawn with the compass at 35 mm (common practice)', () => {
		const res = computePattern(
			{ diameterMm: 70, count: 1, widthMm: 100, lengthMm: 120 },
			{ svg: false }
		);
		// Common practice: the compass is set to the radius, half the diameter.
		expect(res.compassRadiusMm).toBe(35);
		expect(res.steps.some((s) => s.includes('compass to 35 mm'))).toBe(true);
	});

	it('three rosettes spaced by the radius span 140 mm on the centre line (common practice)', () => {
		const res = computePattern(
			{ diameterMm: 70, count: 3, widthMm: 100, lengthMm: 300 },
			{ svg: false }
		);
		const [a, , c] = res.rosettes;
		// Common practice: centres r apart, so the row spans 2r + 2·r = 4r = 140 mm.
		expect(c.y + c.r - (a.y - a.r)).toBeCloseTo(140, 9);
		for (const k of res.rosettes) expect(k.x).toBe(50); // all on the centre line of a 100 mm blank
	});

	it('the stepping starts on the centre line: two petal tips of each rosette lie on it (issue 4)', () => {
		const res = computePattern(
			{ diameterMm: 70, count: 2, widthMm: 100, lengthMm: 300 },
			{ svg: false }
		);
		// Tips on the centre line: every petal edge that ends at x = 50 away from a centre.
		const tips = res.drawing.chips
			.filter((k) => k.kind === 'petal')
			.flatMap((k) => k.edges.map((e) => e.to))
			.filter((p) => Math.abs(p.x - 50) < 1e-9);
		expect(tips.length).toBeGreaterThanOrEqual(4);
	});

	it('rules a 26 mm edge at 13 mm, ±5, then 2 and 1.5 beyond, and counts 5 mm squares (common practice)', () => {
		const b = layoutBorder({ ...BORDER_DEFAULTS, edgeMm: 26 }, 100);
		// Issue 4's worked example (common practice): centre 13, ±5 → 8/18, +2 → 6/20, +1.5 → 4.5/21.5.
		expect([...b.rules].sort((p, q) => p - q)).toEqual([4.5, 6, 8, 13, 18, 20, 21.5]);
		// 5 mm grid steps (common practice): 90 mm between start marks 5 mm from each end → 18 squares,
		// 10 mm band → 2 rows; two triangles per square.
		expect(b.stepMm).toBe(5);
		expect(b.columns).toBe(18);
		expect(b.rows).toBe(2);
		expect(b.triangles).toHaveLength(18 * 2 * 2);
		for (const t of b.triangles) {
			const xs = t.map((p) => p.x);
			expect(Math.max(...xs) - Math.min(...xs)).toBeCloseTo(5, 12); // each triangle spans one 5 mm step
		}
	});

	it('counts the border triangles as chips', () => {
		const res = computePattern(
			{
				diameterMm: 70,
				count: 1,
				widthMm: 100,
				lengthMm: 110,
				border: { edgeMm: 26, trianglesPerSquare: 1 }
			},
			{ svg: false }
		);
		// 100 mm of edge between 5 mm start marks = 20 squares × 2 rows × 1 triangle, plus 12 rosette chips.
		expect(res.chips.filter((c) => c.kind === 'triangle')).toHaveLength(40);
		expect(res.chipCount).toBe(52);
	});

	it('harder woods take longer (common practice), scaled by Wood Handbook side hardness', () => {
		const bass = WOODS.find((w) => w.slug === 'basswood')!;
		const maple = WOODS.find((w) => w.slug === 'maple')!;
		// Wood Handbook Table 5-3b side hardness: basswood 1,800 N, sugar maple 6,400 N.
		expect(bass.sideHardnessN).toBe(1800);
		expect(maple.sideHardnessN).toBe(6400);
		expect(hardnessFactor(maple.sideHardnessN)).toBeCloseTo(Math.sqrt(6400 / 1800), 12);
		const input = { diameterMm: 70, count: 1, widthMm: 100, lengthMm: 120 };
		const soft = computePattern({ ...input, woodSlug: 'basswood' }, { svg: false });
		const hard = computePattern({ ...input, woodSlug: 'maple' }, { svg: false });
		expect(hard.estimateMinutes).toBeGreaterThan(soft.estimateMinutes);
	});
});

describe('fit on the blank', () => {
	it('warns when the rosette is wider than the blank less its margins', () => {
		const res = computePattern(
			{ diameterMm: 70, count: 1, widthMm: 75, lengthMm: 120 },
			{ svg: false }
		);
		expect(res.warnings.map((w) => w.code)).toContain('too-wide');
	});
	it('warns when the row runs off the ends, and when it runs into a curved top', () => {
		const long = computePattern(
			{ diameterMm: 70, count: 5, widthMm: 100, lengthMm: 150 },
			{ svg: false }
		);
		expect(long.warnings.map((w) => w.code)).toContain('too-long');
		const top = computePattern(
			{ diameterMm: 70, count: 1, widthMm: 90, lengthMm: 200, curvedTop: true, firstCentreMm: 30 },
			{ svg: false }
		);
		expect(top.warnings.map((w) => w.code)).toContain('top-end');
	});
	it('is quiet when it fits', () => {
		const ok = computePattern(
			{ diameterMm: 70, count: 3, widthMm: 100, lengthMm: 300, curvedTop: true },
			{ svg: false }
		);
		expect(ok.warnings).toEqual([]);
	});
});

describe('initials in the medallion', () => {
	const font = letterFont();
	it('centres the letters in the medallion and keeps them inside it with the margin', () => {
		const res = computePattern(
			{ diameterMm: 70, count: 3, initials: 'HMW', widthMm: 100, lengthMm: 300 },
			{ font }
		);
		const lt = res.drawing.lettering!;
		expect(lt.letters.map((l) => l.char).join('')).toBe('HMW');
		const nums = lt.letters.flatMap((l) => (l.d.match(/-?\d+(\.\d+)?/g) ?? []).map(Number));
		const xs = nums.filter((_, i) => i % 2 === 0);
		const ys = nums.filter((_, i) => i % 2 === 1);
		const cx = (Math.min(...xs) + Math.max(...xs)) / 2;
		const cy = (Math.min(...ys) + Math.max(...ys)) / 2;
		expect(Math.abs(cx - lt.medallion.x)).toBeLessThan(0.3);
		expect(Math.abs(cy - lt.medallion.y)).toBeLessThan(0.3);
		for (let i = 0; i < xs.length; i++) {
			expect(Math.hypot(xs[i] - lt.medallion.x, ys[i] - lt.medallion.y)).toBeLessThanOrEqual(
				lt.medallion.r - 2 + 0.5
			);
		}
		expect(res.svg).toContain(lt.letters[0].d);
		expect(res.letterCount).toBe(3);
	});
	it('a single letter stands taller than three', () => {
		const input = { diameterMm: 70, count: 1, widthMm: 100, lengthMm: 120 };
		const one = computePattern({ ...input, initials: 'H' }, { font, svg: false });
		const three = computePattern({ ...input, initials: 'HMW' }, { font, svg: false });
		expect(one.drawing.lettering!.capHeightMm).toBeGreaterThan(
			three.drawing.lettering!.capHeightMm
		);
	});
	it('warns when letters come out too small to carve (thresholds: common practice)', () => {
		const res = computePattern(
			{ diameterMm: 30, count: 1, initials: 'WWW', widthMm: 60, lengthMm: 60 },
			{ font, svg: false }
		);
		expect(res.warnings.map((w) => w.code)).toContain('letters-small');
		const big = computePattern(
			{ diameterMm: 120, count: 1, initials: 'AB', widthMm: 140, lengthMm: 140 },
			{ font, svg: false }
		);
		expect(big.warnings).toEqual([]);
	});
});
