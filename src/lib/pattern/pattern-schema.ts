/**
 * Inputs of the rosette layout: the public pattern API, the buyer's personalisation (also
 * checked by the cart) and the carver's layout planner, built from one another.
 */
import { z } from 'zod';
import { ROSETTE_STYLES, type RosetteStyle } from './styles';
import { WOODS } from '../catalogue/woods';

/** Empty query values count as "not given", so defaults apply instead of a zero. */
const blankToUndefined = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v);

const mm = (label: string, min: number, max: number) =>
	z.coerce
		.number({
			error: (iss) =>
				iss.input === undefined
					? `${label} is required (mm).`
					: `${label} must be a number of millimetres.`
		})
		.min(min, `${label} must be at least ${min} mm.`)
		.max(max, `${label} must be at most ${max} mm.`);
const mmField = (label: string, min: number, max: number) =>
	z.preprocess(blankToUndefined, mm(label, min, max));
const mmOptional = (label: string, min: number, max: number) =>
	z.preprocess(blankToUndefined, mm(label, min, max).optional());

const flag = z.preprocess(
	blankToUndefined,
	z
		.enum(['0', '1', 'true', 'false', 'on', 'off'], { error: 'Use 1 for yes or 0 for no.' })
		.transform((v) => v === '1' || v === 'true' || v === 'on')
		.optional()
);

export const initialsSchema = z
	.string({ error: 'Type 1 to 3 letters.' })
	.trim()
	.toUpperCase()
	.regex(/^[A-Z]{1,3}$/, 'Initials are 1 to 3 letters, A to Z.');

export const woodSlugSchema = z
	.string({ error: 'Choose a wood.' })
	.trim()
	.refine((s) => WOODS.some((w) => w.slug === s), 'Choose one of our woods.');

export const styleSchema = z.enum(
	Object.keys(ROSETTE_STYLES) as [RosetteStyle, ...RosetteStyle[]],
	{
		error: 'Choose a rosette style.'
	}
);

/** What a buyer chooses for a personalised piece. */
export const personalisationSchema = z.object({
	initials: initialsSchema,
	wood: woodSlugSchema,
	style: styleSchema.default('classic')
});
export type PersonalisationInput = z.infer<typeof personalisationSchema>;

/** GET /api/pattern query. */
export const patternQuerySchema = z
	.object({
		diameter: mmField('Diameter', 20, 300),
		count: z.preprocess(
			blankToUndefined,
			z.coerce
				.number({ error: 'Count must be a whole number.' })
				.int('Count must be a whole number.')
				.min(1, 'At least one rosette.')
				.max(12, 'At most 12 rosettes.')
				.default(1)
		),
		spacing: mmOptional('Spacing', 5, 600),
		split: flag,
		initials: z.preprocess(blankToUndefined, initialsSchema.optional()),
		wood: z.preprocess(blankToUndefined, woodSlugSchema.default('basswood')),
		width: mmField('Width', 20, 1000),
		length: mmField('Length', 20, 2000)
	})
	.superRefine((v, ctx) => {
		if (v.spacing !== undefined && v.spacing < v.diameter / 10) {
			ctx.addIssue({
				code: 'custom',
				path: ['spacing'],
				message: 'Spacing must be at least a tenth of the diameter.'
			});
		}
	});
export type PatternQuery = z.infer<typeof patternQuerySchema>;

/** The carver's layout planner: the pattern query plus the blank's shape, border and paper. */
export const plannerSchema = patternQuerySchema.safeExtend({
	thickness: mmOptional('Thickness', 3, 200),
	curvedTop: flag,
	margin: mmOptional('Margin', 0, 100),
	firstCentre: mmOptional('First centre', 0, 2000),
	border: flag,
	edge: mmOptional('Edge width', 4, 200),
	offsets: z.preprocess(
		blankToUndefined,
		z
			.string()
			.regex(
				/^\s*\d+(\.\d+)?(\s*[, ]\s*\d+(\.\d+)?){0,5}\s*$/,
				'List up to six offsets in mm, e.g. 5, 2, 1.5.'
			)
			.transform((s) => s.split(/[ ,]+/).filter(Boolean).map(Number))
			.optional()
	),
	step: mmOptional('Grid step', 1, 50),
	start: mmOptional('Start mark', 0, 500),
	triangles: z.preprocess(
		blankToUndefined,
		z
			.enum(['1', '2', '4'], { error: 'Choose 1, 2 or 4 triangles a square.' })
			.transform(Number)
			.optional()
	),
	paper: z.preprocess(
		blankToUndefined,
		z.enum(['a4', 'letter'], { error: 'Choose A4 or US Letter.' }).default('a4')
	)
});
export type PlannerQuery = z.infer<typeof plannerSchema>;

/** Query → the engine's input. */
export function patternInputFrom(q: PatternQuery | PlannerQuery) {
	const p = q as Partial<PlannerQuery> & PatternQuery;
	return {
		diameterMm: q.diameter,
		count: q.count,
		spacingMm: q.spacing,
		split: !!q.split,
		initials: q.initials,
		woodSlug: q.wood,
		widthMm: q.width,
		lengthMm: q.length,
		thicknessMm: p.thickness,
		curvedTop: !!p.curvedTop,
		marginMm: p.margin,
		firstCentreMm: p.firstCentre,
		border: p.border
			? {
					edgeMm: p.edge ?? p.thickness,
					...(p.offsets ? { offsetsMm: p.offsets } : {}),
					...(p.step ? { stepMm: p.step } : {}),
					...(p.start !== undefined ? { startMm: p.start } : {}),
					...(p.triangles ? { trianglesPerSquare: p.triangles as 1 | 2 | 4 } : {})
				}
			: null
	};
}

/** zod issues → { field: [messages] }. */
export function patternFieldErrors(error: z.ZodError): Record<string, string[]> {
	const out: Record<string, string[]> = {};
	for (const issue of error.issues)
		(out[String(issue.path[0] ?? 'form')] ??= []).push(issue.message);
	return out;
}
