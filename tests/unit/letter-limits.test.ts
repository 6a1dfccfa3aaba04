import { describe, expect, it } from 'vitest';
import { letterFit, letterLimits } from '$lib/pattern/cuttable';
import { waysOut } from '$lib/pattern/ways-out';
import { letterFont } from '$lib/pattern/letter-font';
import { computePattern } from '$lib/pattern';
import { drawPreview } from '$lib/pattern/personaliser-draw';

/**
 * The smallest initials a knife cuts cleanly, per wood. Basswood's 6 mm letters with 1.2 mm
 * strokes are common practice; the other woods follow our own model (scaled by the fourth root
 * of the side hardness ratio, rounded up to 0.1 mm), checked here against the Wood Handbook's
 * published hardness rather than the app's own table.
 */
const font = letterFont();
// Side hardness at 12 % MC, newtons: USDA Wood Handbook (FPL-GTR-282, Table 5-3b).
const HANDBOOK_N = { basswood: 1800, butternut: 2200, cherry: 4200, walnut: 4500, maple: 6400 };
const model = (n: number, base: number) =>
	Math.ceil(base * Math.pow(HANDBOOK_N.basswood / n, 0.25) * 10 - 1e-9) / 10;

describe('per-wood minimum letters', () => {
	it('basswood: letters 6 mm tall, strokes 1.2 mm wide (common practice)', () => {
		const l = letterLimits('basswood');
		expect(l.minCapHeightMm).toBe(6);
		expect(l.minStrokeMm).toBe(1.2);
	});

	it('every wood follows the stated model from the handbook hardness (our own model)', () => {
		for (const [slug, n] of Object.entries(HANDBOOK_N)) {
			const l = letterLimits(slug);
			// Base values common practice; hardness from the Wood Handbook, Table 5-3b.
			expect(l.minCapHeightMm, slug).toBe(model(n, 6));
			expect(l.minStrokeMm, slug).toBe(model(n, 1.2));
		}
		// Worked by hand: (1800 / 6400)^¼ = 0.7282 → 4.37 → 4.4 mm and 0.874 → 0.9 mm.
		expect(letterLimits('maple')).toMatchObject({ minCapHeightMm: 4.4, minStrokeMm: 0.9 });
	});

	it('harder woods hold finer letters (common practice), never finer than softer ones', () => {
		const bySoftness = ['basswood', 'butternut', 'cherry', 'walnut', 'maple'].map(letterLimits);
		for (let i = 1; i < bySoftness.length; i++) {
			expect(bySoftness[i].minCapHeightMm).toBeLessThanOrEqual(bySoftness[i - 1].minCapHeightMm);
			expect(bySoftness[i].minStrokeMm).toBeLessThanOrEqual(bySoftness[i - 1].minStrokeMm);
		}
		expect(letterLimits('maple').minCapHeightMm).toBeLessThan(
			letterLimits('basswood').minCapHeightMm
		);
	});

	it('an unknown wood gets basswood’s limits, the strictest of our woods', () => {
		expect(letterLimits('no-such-wood')).toMatchObject({ minCapHeightMm: 6, minStrokeMm: 1.2 });
	});
});

describe('letterFit: the one check the personaliser and the server make', () => {
	it('measures the same letters the engine draws', () => {
		const fit = letterFit('AB', 36, 'cherry', font);
		const drawn = computePattern(
			{
				diameterMm: 36,
				count: 5,
				spacingMm: 18,
				initials: 'AB',
				woodSlug: 'cherry',
				widthMm: 280,
				lengthMm: 280
			},
			{ font, svg: false }
		);
		expect(fit.capHeightMm).toBeCloseTo(drawn.drawing.lettering!.capHeightMm, 9);
		// The engine's own warning agrees with the refusal.
		expect(drawn.warnings.map((w) => w.code)).toContain('strokes-thin');
	});

	it('two letters on the 36 mm plate rosette are refused in cherry (5.0 mm, 0.96 mm strokes)', () => {
		const fit = letterFit('AB', 36, 'cherry', font);
		expect(fit.ok).toBe(false);
		expect(fit.capHeightMm).toBeCloseTo(5.0, 1);
		expect(fit.strokeMm).toBeLessThan(1);
	});

	it('a bigger rosette carves the same letters taller, in proportion to its radius', () => {
		// Similar figures scale linearly (Euclid, Elements VI): twice the rosette, twice the letters.
		const small = letterFit('AB', 36, 'cherry', font);
		const big = letterFit('AB', 72, 'cherry', font);
		expect(big.capHeightMm).toBeGreaterThan(small.capHeightMm * 2);
		expect(big.ok).toBe(true);
	});
});

describe('the ways out of a refusal', () => {
	const plate = {
		diameterMm: 36,
		style: 'classic' as const,
		wood: 'cherry',
		woods: ['cherry', 'maple', 'walnut'],
		larger: [
			{ slug: 'twin', title: 'Twin', diameterMm: 50, woods: ['basswood', 'cherry', 'walnut'] },
			{ slug: 'holder', title: 'Holder', diameterMm: 60, woods: ['basswood', 'cherry'] }
		],
		font
	};

	it('offers fewer letters, the open centre, a harder wood and the smallest larger piece', () => {
		const w = waysOut({ ...plate, initials: 'AB' })!;
		expect(w.fit.ok).toBe(false);
		expect(w.message).toMatch(/4\.9 mm tall/);
		expect(w.fewer?.initials).toBe('A');
		expect(w.style?.style).toBe('open');
		expect(w.wood?.slug).toBe('maple');
		expect(w.piece?.slug).toBe('twin');
		// Each way out really is cuttable by the same check.
		expect(letterFit('A', 36, 'cherry', font).ok).toBe(true);
		expect(letterFit('AB', 36, 'cherry', font, 0.6).ok).toBe(true);
		expect(letterFit('AB', 36, 'maple', font).ok).toBe(true);
		expect(letterFit('AB', 50, 'cherry', font).ok).toBe(true);
	});

	it('leaves out an offer that would not make the letters cuttable', () => {
		const w = waysOut({ ...plate, initials: 'ABC', larger: [] })!;
		// Three letters are too small even in maple on this rosette.
		expect(letterFit('ABC', 36, 'maple', font).ok).toBe(false);
		expect(w.wood).toBeNull();
		expect(w.piece).toBeNull();
		expect(w.fewer?.initials).toBe('A');
		expect(w.style?.style).toBe('open');
	});

	it('is silent when the letters already fit', () => {
		expect(waysOut({ ...plate, initials: 'A' })).toBeNull();
		expect(waysOut({ ...plate, wood: 'maple', initials: 'AB' })).toBeNull();
	});

	it('the preview carries the refusal instead of a small warning', () => {
		const p = drawPreview({
			pattern: { diameterMm: 36, count: 5, spacingMm: 18 },
			widthMm: 280,
			lengthMm: 280,
			initials: 'ab',
			wood: 'cherry',
			style: 'classic',
			idPrefix: 'pz',
			woods: plate.woods
		});
		expect(p.refusal?.fewer?.initials).toBe('A');
		expect(p.warnings.map((w) => w.code)).not.toContain('strokes-thin');
	});
});
