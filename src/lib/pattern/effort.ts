/**
 * Carving time estimate. Our own simple model, not a published one; the owner tunes it.
 *
 *   minutes = setup + Σ chips (secondsPerChip + secondsPerMmCut · cut length) · h / 60
 *                   + letters · minutesPerLetter · h
 *   h = (side hardness / reference hardness) ^ hardnessExponent
 *
 * Harder woods take markedly longer per chip (common practice); the square-root default makes
 * sugar maple (6,400 N) about 1.9 × basswood (1,800 N, the reference: Wood Handbook side
 * hardness at 12 % MC).
 */
export type EffortModel = {
	setupMinutes: number;
	secondsPerChip: number;
	secondsPerMmCut: number;
	minutesPerLetter: number;
	referenceHardnessN: number;
	hardnessExponent: number;
};

export const EFFORT_DEFAULTS: EffortModel = {
	setupMinutes: 10,
	secondsPerChip: 20,
	secondsPerMmCut: 0.6,
	minutesPerLetter: 6,
	referenceHardnessN: 1800,
	hardnessExponent: 0.5
};

export function hardnessFactor(sideHardnessN: number, m: EffortModel = EFFORT_DEFAULTS): number {
	return Math.pow(sideHardnessN / m.referenceHardnessN, m.hardnessExponent);
}

export function estimateMinutes(
	chips: { cutLengthMm: number }[],
	letterCount: number,
	sideHardnessN: number,
	m: EffortModel = EFFORT_DEFAULTS
): number {
	const h = hardnessFactor(sideHardnessN, m);
	const chipSeconds = chips.reduce(
		(s, c) => s + m.secondsPerChip + m.secondsPerMmCut * c.cutLengthMm,
		0
	);
	return Math.round(m.setupMinutes + (chipSeconds * h) / 60 + letterCount * m.minutesPerLetter * h);
}
