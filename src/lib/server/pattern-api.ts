/** GET /api/pattern: validate the query, compute with the server's letter font, pick the public fields. */
import { computePattern } from '$lib/pattern';
import { patternFieldErrors, patternInputFrom, patternQuerySchema } from '$lib/schemas/pattern';
import type { GlyphSource } from '$lib/pattern/lettering';

export type PatternApiResponse =
	| { status: 200; body: Record<string, unknown> }
	| { status: 400; body: { error: string; fields: Record<string, string[]> } };

export function patternResponse(
	params: URLSearchParams,
	font: GlyphSource | null
): PatternApiResponse {
	const parsed = patternQuerySchema.safeParse(Object.fromEntries(params));
	if (!parsed.success) {
		return {
			status: 400,
			body: {
				error: 'Some of the pattern settings are not usable.',
				fields: patternFieldErrors(parsed.error)
			}
		};
	}
	const res = computePattern(patternInputFrom(parsed.data), { font, idPrefix: 'api' });
	return {
		status: 200,
		body: {
			compassRadiusMm: res.compassRadiusMm,
			rosettes: res.rosettes,
			chips: res.chips,
			chipCount: res.chipCount,
			letterCount: res.letterCount,
			cutLengthMm: res.cutLengthMm,
			estimateMinutes: res.estimateMinutes,
			warnings: res.warnings,
			steps: res.steps,
			svg: res.svg
		}
	};
}
