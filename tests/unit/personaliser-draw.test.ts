import { describe, expect, it } from 'vitest';
import { drawPreview } from '$lib/pattern/personaliser-draw';
import { computePattern } from '$lib/pattern';

/**
 * The personaliser's picture is drawn by the server for the first paint and by the browser after
 * that, from one function; both must match what the engine itself draws.
 */
const bottleHolder = {
	pattern: { diameterMm: 60, count: 1, spacingMm: 0, split: false },
	widthMm: 90,
	lengthMm: 300,
	thicknessMm: 19,
	style: 'classic' as const,
	idPrefix: 'pz'
};

describe('personaliser preview', () => {
	it('counts the chips of one six-petal rosette and carries the initials', () => {
		const p = drawPreview({ ...bottleHolder, initials: 'kmr', wood: 'basswood' });
		// Common practice: a six-petal rosette is 6 petals + 6 chips between them = 12 chips.
		expect(p.chipCount).toBe(12);
		expect(p.letterCount).toBe(3);
		expect(p.svg).toContain('initials KMR');
		expect(p.wholeSvg).toContain('id="pzw');
	});

	it('leaves out what is not a letter A to Z, and keeps at most three', () => {
		const typed = drawPreview({ ...bottleHolder, initials: 'a1-b?cd', wood: 'basswood' });
		const clean = drawPreview({ ...bottleHolder, initials: 'ABC', wood: 'basswood' });
		expect(typed.svg).toBe(clean.svg);
		expect(typed.letterCount).toBe(3);
	});

	it('draws no letters for blank initials, as the page shows before anyone types', () => {
		const p = drawPreview({ ...bottleHolder, initials: '', wood: 'cherry' });
		expect(p.letterCount).toBe(0);
		expect(p.chipCount).toBe(12);
	});

	it('the split style draws halved chips, as the engine does for a split layout', () => {
		const p = drawPreview({ ...bottleHolder, style: 'split', initials: '', wood: 'basswood' });
		// Common practice: a halved (split) chip is cut as two facets; the engine counts each.
		const reference = computePattern({
			diameterMm: 60,
			count: 1,
			split: true,
			widthMm: 90,
			lengthMm: 300
		});
		expect(p.chipCount).toBe(reference.chipCount);
		expect(p.chipCount).toBeGreaterThan(12);
	});
});
