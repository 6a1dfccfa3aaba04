/** GET /api/pattern: validate the query, compute with the server's letter font, pick the public fields. */
import { LRUCache } from 'lru-cache';
import { computePattern } from '$lib/pattern';
import {
	patternFieldErrors,
	patternInputFrom,
	patternQuerySchema,
	type PatternQuery
} from '$lib/pattern/pattern-schema';
import type { GlyphSource } from '$lib/pattern/lettering';

export type PatternApiResponse =
	| { status: 200; body: Record<string, unknown> }
	| { status: 400; body: { error: string; fields: Record<string, string[]> } };

/**
 * The most chips (estimated, an upper bound) the public API draws for one request: at most
 * about 700 real chips, ≈ 70 ms of CPU here, instead of 1,000+ chips and 450 ms.
 */
export const MAX_PATTERN_WORK = 1200;
/** Chips in one plain six-petal rosette (common practice: 6 petals + 6 between). */
const CHIPS_PER_ROSETTE = 12;

/**
 * How many chips a query will draw, estimated before drawing: every rosette adds its own twelve,
 * and every neighbour it overlaps cuts them again, so the work grows with the overlaps; split
 * chips double it. Over a grid of diameters, counts and spacings the real count was at most
 * 1.73 × (rosettes + overlaps) × 12; twice that is used, so this never falls below the real one.
 */
export function patternWork(q: PatternQuery): number {
	const d = q.diameter;
	const s = q.spacing ?? d / 2;
	let faces = 0;
	for (let i = 0; i < q.count; i++) {
		let overlaps = 0;
		for (let j = 0; j < q.count; j++) if (j !== i && Math.abs(i - j) * s < d) overlaps++;
		faces += 1 + overlaps;
	}
	return 2 * faces * CHIPS_PER_ROSETTE * (q.split ? 2 : 1);
}

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
	if (patternWork(parsed.data) > MAX_PATTERN_WORK) return tooMuchWork();
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

function tooMuchWork(): PatternApiResponse {
	const message = `This layout is too large for the pattern API (more than about ${MAX_PATTERN_WORK} chips). Use fewer rosettes, space them wider, or leave the chips whole.`;
	return { status: 400, body: { error: message, fields: { count: [message] } } };
}

/**
 * Answers as JSON text, cached: identical layouts (after the query is parsed, so "70", "70.0"
 * and a reordered query are one entry) are drawn once. Bounded by count and by bytes.
 */
const cache = new LRUCache<string, { status: 200 | 400; text: string }>({
	max: 500,
	maxSize: 32 * 1024 * 1024,
	sizeCalculation: (v) => v.text.length + 1
});

export function cacheKeyOf(params: URLSearchParams): string | null {
	const parsed = patternQuerySchema.safeParse(Object.fromEntries(params));
	if (!parsed.success) return null;
	const d = parsed.data as Record<string, unknown>;
	return JSON.stringify(
		Object.keys(d)
			.sort()
			.map((k) => [k, d[k]])
	);
}

export function patternJson(
	params: URLSearchParams,
	font: GlyphSource | null
): { status: 200 | 400; text: string; cached: boolean } {
	const key = cacheKeyOf(params);
	const hit = key ? cache.get(key) : undefined;
	if (hit) return { ...hit, cached: true };
	const { status, body } = patternResponse(params, font);
	const out = { status, text: JSON.stringify(body) };
	if (key) cache.set(key, out);
	return { ...out, cached: false };
}
