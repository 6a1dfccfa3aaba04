/**
 * The smallest initials a knife cuts cleanly, per wood, and the one check of a layout against
 * them. Pure: the personaliser refuses with it in the browser, the cart and checkout refuse with
 * it on the server.
 *
 * Basswood, the chip carver's usual wood, sets the base: letters 6 mm tall with strokes 1.2 mm
 * wide (common practice: smaller letters crumble between two knife cuts, and a V-cut needs room
 * for two walls meeting at the bottom). Harder, denser woods hold a finer wall; our own model
 * scales both minimums by the fourth root of the side hardness ratio (Wood Handbook, USDA FPL,
 * Table 5-3; hardness grows about as the square of specific gravity, so this is about the square
 * root of the density ratio), rounded UP to the next 0.1 mm so the values read as plain tenths.
 * Softer woods than basswood come out larger. The owner may tune BASE_LIMITS.
 */
import { setInitials, LETTERING_DEFAULTS, type GlyphSource } from './lettering';
import { fmt } from './geometry';
import { WOODS, woodBySlug } from '../catalogue/woods';

/** Basswood, common practice (see above). */
export const BASE_LIMITS = { capHeightMm: 6, strokeMm: 1.2, sideHardnessN: 1800 };

export type LetterLimits = { woodName: string; minCapHeightMm: number; minStrokeMm: number };

const upTenth = (mm: number) => Math.ceil(mm * 10 - 1e-9) / 10;

/** Our model (see above); unknown woods get basswood's limits. */
export function letterLimits(woodSlug: string | undefined): LetterLimits {
	const wood = woodBySlug(woodSlug ?? '') ?? WOODS[0];
	const k = Math.pow(BASE_LIMITS.sideHardnessN / wood.sideHardnessN, 0.25);
	return {
		woodName: wood.name,
		minCapHeightMm: upTenth(BASE_LIMITS.capHeightMm * k),
		minStrokeMm: upTenth(BASE_LIMITS.strokeMm * k)
	};
}

export type LetterFit = LetterLimits & {
	initials: string;
	capHeightMm: number;
	strokeMm: number;
	ok: boolean;
};

/**
 * How tall and how thin the initials come out in a rosette of this diameter (the medallion is
 * the same share of the radius whichever rosette of the piece carries them), against the wood.
 */
export function letterFit(
	initials: string,
	diameterMm: number,
	woodSlug: string | undefined,
	font: GlyphSource,
	medallionRatio = LETTERING_DEFAULTS.medallionRatio
): LetterFit {
	const limits = letterLimits(woodSlug);
	const set = setInitials(initials, { x: 0, y: 0, r: diameterMm / 2 }, font, {
		...LETTERING_DEFAULTS,
		medallionRatio
	});
	const strokeMm = set.letters.length ? Math.min(...set.letters.map((l) => l.strokeMm)) : 0;
	return {
		...limits,
		initials,
		capHeightMm: set.capHeightMm,
		strokeMm,
		ok: set.capHeightMm >= limits.minCapHeightMm && strokeMm >= limits.minStrokeMm
	};
}

/** The refusal in words, naming both minimums for the wood. */
export function refusalText(fit: LetterFit): string {
	return (
		`“${fit.initials}” would be carved ${fmt(fit.capHeightMm, 1)} mm tall with strokes ` +
		`${fmt(fit.strokeMm, 2)} mm wide: too small to cut cleanly. In ${fit.woodName.toLowerCase()} ` +
		`a knife needs letters at least ${fmt(fit.minCapHeightMm, 1)} mm tall with strokes at least ` +
		`${fmt(fit.minStrokeMm, 1)} mm wide.`
	);
}
