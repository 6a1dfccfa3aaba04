import { z } from 'zod';
import { pieceKinds } from '$lib/catalogue/kinds';
import { parseMajor } from '$lib/locale/money';

const int = (label: string, min: number, maxValue: number) =>
	z.coerce
		.number({ error: `${label}: type a whole number.` })
		.int(`${label}: type a whole number.`)
		.min(min, `${label} is at least ${min}.`)
		.max(maxValue, `${label} is at most ${maxValue}.`);

const checkbox = z
	.union([z.literal('on'), z.literal('true'), z.literal('')])
	.optional()
	.transform((v) => v === 'on' || v === 'true');

/** Price as typed in the shop's currency ("48" or "48.50"), kept as integer minor units. */
export const priceMinor = z
	.string()
	.trim()
	.transform((s, ctx) => {
		const minor = s.length <= 12 ? parseMajor(s) : null;
		if (minor === null) {
			ctx.addIssue({ code: 'custom', message: 'Type a price like 48 or 48.50.' });
			return z.NEVER;
		}
		return minor;
	})
	.pipe(
		z
			.number()
			.int()
			.min(100, 'A piece costs at least 1.00.')
			.max(99_999_999, 'A piece costs at most 999999.99.')
	);

/** One piece as the owner edits it: dimensions in mm, price in minor units, rosette layout. */
export const pieceForm = z
	.object({
		title: z.string().trim().min(2, 'Give the piece a name.').max(120),
		slug: z
			.string()
			.trim()
			.toLowerCase()
			.regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'Lower-case letters, digits and single hyphens.')
			.max(80),
		kind: z.enum(pieceKinds, { error: 'Choose what kind of piece it is.' }),
		summary: z.string().trim().min(5, 'One line for the shop list.').max(255),
		description: z.string().trim().min(10, 'Describe the piece in a sentence or two.').max(4000),
		lengthMm: int('Length (mm)', 10, 2000),
		widthMm: int('Width (mm)', 10, 2000),
		thicknessMm: int('Thickness (mm)', 2, 200),
		price: priceMinor,
		woodIds: z.array(z.coerce.number().int().positive()).min(1, 'Offer at least one wood.'),
		personalisable: checkbox,
		foodContact: checkbox,
		leadDays: int('Lead days', 0, 180),
		diameterMm: int('Rosette diameter (mm)', 10, 400),
		count: int('Rosettes', 1, 8),
		spacingMm: int('Spacing (mm)', 0, 400),
		split: checkbox,
		careNotes: z.string().trim().max(2000, 'Keep care notes under 2000 characters.')
	})
	.refine((p) => p.diameterMm <= Math.min(p.lengthMm, p.widthMm), {
		path: ['diameterMm'],
		message: 'The rosette is wider than the piece.'
	});

export type PieceForm = z.infer<typeof pieceForm>;

export const PIECE_TEXT_FIELDS = [
	'title',
	'slug',
	'kind',
	'summary',
	'description',
	'lengthMm',
	'widthMm',
	'thicknessMm',
	'price',
	'leadDays',
	'diameterMm',
	'count',
	'spacingMm',
	'careNotes'
] as const;

/** Reads the form fields (woods come as several values of one name) into the schema's shape. */
export function pieceFormInput(data: FormData) {
	const out: Record<string, unknown> = {};
	for (const k of PIECE_TEXT_FIELDS) {
		const v = data.get(k);
		out[k] = typeof v === 'string' ? v : '';
	}
	if (!out.slug) out.slug = slugify(String(out.title));
	for (const k of ['personalisable', 'foodContact', 'split'] as const) {
		const v = data.get(k);
		out[k] = typeof v === 'string' ? v : undefined;
	}
	out.woodIds = data.getAll('woodIds').filter((v) => typeof v === 'string');
	return out;
}

export function slugify(title: string) {
	return title
		.toLowerCase()
		.normalize('NFKD')
		.replace(/[^a-z0-9]+/g, '-')
		.replace(/^-+|-+$/g, '')
		.slice(0, 80);
}
