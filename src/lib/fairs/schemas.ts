import { z } from 'zod';
import { emailAddress } from '../forms/email';
import { parseMajor, parsePercent } from '$lib/locale/money';

const text = (label: string, max: number) =>
	z
		.string({ error: `Enter ${label}.` })
		.trim()
		.min(1, `Enter ${label}.`)
		.max(max, `Keep ${label} under ${max} characters.`);

/** A typed amount like "120" or "120.50" in the shop's currency → minor units; empty is nothing. */
export const moneyField = (label: string) =>
	z
		.string()
		.trim()
		.transform((v, ctx) => {
			if (v === '') return 0;
			const minor = parseMajor(v);
			if (minor === null || minor > 100_000_000) {
				ctx.addIssue({ code: 'custom', message: `Enter ${label} as an amount like 120.00.` });
				return z.NEVER;
			}
			return minor;
		});

/** A percentage like "7.25" → basis points (725), at most two decimals. */
const percentField = (label: string, maxPercent: number) =>
	z
		.string()
		.trim()
		.transform((v, ctx) => {
			if (v === '') return 0;
			const bp = parsePercent(v);
			if (bp === null || bp > maxPercent * 100) {
				ctx.addIssue({
					code: 'custom',
					message: `Enter ${label} as a percentage from 0 to ${maxPercent}, like 7.25.`
				});
				return z.NEVER;
			}
			return bp;
		});

const isoDate = (label: string) =>
	z
		.string()
		.trim()
		.regex(/^\d{4}-\d{2}-\d{2}$/, `Enter ${label} as a date.`)
		.refine((v) => !Number.isNaN(Date.parse(v)), `Enter ${label} as a real date.`);

export const fairFormSchema = z
	.object({
		name: text('the fair’s name', 120),
		place: text('where it is', 160),
		startsOn: isoDate('the first day'),
		endsOn: isoDate('the last day'),
		boothFee: moneyField('the booth fee'),
		otherCosts: moneyField('the other costs'),
		salesTax: percentField('the sales-tax rate', 30),
		pricesIncludeTax: z
			.string()
			.optional()
			.transform((v) => v === 'on' || v === 'true'),
		cashFloat: moneyField('the cash float'),
		cardFee: percentField('the card reader’s fee', 15),
		helperDiscount: percentField('the helpers’ discount limit', 100),
		openHours: z
			.string()
			.trim()
			.transform((v, ctx) => {
				const n = Number(v || '8');
				if (!Number.isFinite(n) || n <= 0 || n > 500 || Math.round(n * 4) !== n * 4) {
					ctx.addIssue({ code: 'custom', message: 'Enter the hours open, like 8 or 7.5.' });
					return z.NEVER;
				}
				return Math.round(n * 60);
			}),
		notes: z.string().trim().max(2000, 'Keep the notes under 2,000 characters.').optional()
	})
	.refine((f) => f.endsOn >= f.startsOn, {
		path: ['endsOn'],
		message: 'The last day cannot come before the first.'
	});
export type FairForm = z.infer<typeof fairFormSchema>;

const wholeCount = (label: string) =>
	z.coerce
		.number({ error: `Enter ${label} as a whole number.` })
		.refine((n) => Number.isInteger(n), `Enter ${label} as a whole number.`)
		.refine((n) => n >= 0, `${label[0].toUpperCase()}${label.slice(1)} cannot be negative.`)
		.refine((n) => n <= 10_000, `${label[0].toUpperCase()}${label.slice(1)} is too large.`);

export type LoadOutLine = z.output<typeof loadOutLineSchema>;
export const loadOutLineSchema = z.object({
	pieceId: z.coerce.number().int().positive(),
	woodId: z.coerce.number().int().positive(),
	quantity: wholeCount('the count to take').refine((n) => n > 0, 'Take at least one.')
});

/**
 * The load-out form: one input per shelf row (take-<piece>-<wood>), each checked on its own, its
 * message under its own name; blank or zero rows are left out.
 */
export const loadOutFormSchema = z.record(z.string(), z.string()).transform((form, ctx) => {
	const lines: LoadOutLine[] = [];
	for (const [key, value] of Object.entries(form)) {
		const m = /^take-(\d+)-(\d+)$/.exec(key);
		if (!m || value.trim() === '' || value.trim() === '0') continue;
		const line = loadOutLineSchema.safeParse({ pieceId: m[1], woodId: m[2], quantity: value });
		if (line.success) lines.push(line.data);
		else ctx.addIssue({ code: 'custom', message: line.error.issues[0].message, path: [key] });
	}
	return lines;
});

/** The helpers ticked to sell at a fair (user ids). */
export const fairHelpersSchema = z.object({ helper: z.array(z.string()) });

export const BOOTH_MAX_SALES = 1000;
export const BOOTH_MAX_BYTES = 2_000_000;
/** How many the booth screen sends at once: well under the limits above. */
export const BOOTH_CHUNK = 50;
/** The booth screen also keeps each batch's body under this, leaving room below the 2 MB cap. */
export const BOOTH_CHUNK_BYTES = 1_500_000;
/** At most this many of one piece on one line, and this many pieces in one sale. */
export const MAX_LINE_QUANTITY = 100;
export const MAX_SALE_PIECES = 200;

const slug = z.string().trim().min(1).max(80);
/** Ids made on the phone: UUIDs, or any 8–36 letters, digits and dashes. */
export const clientId = z
	.string()
	.regex(/^[A-Za-z0-9-]{8,36}$/, 'A sale id is 8 to 36 letters, digits or dashes.');

export const boothSaleSchema = z.object({
	id: clientId,
	at: z.iso.datetime({ offset: true, error: 'The sale time must be an ISO date and time.' }),
	lines: z
		.array(
			z.object({
				pieceSlug: slug,
				woodSlug: slug,
				quantity: z
					.number({ error: 'A quantity is a whole number from 1 to 100.' })
					.int('A quantity is a whole number from 1 to 100.')
					.min(1, 'A quantity is a whole number from 1 to 100.')
					.max(MAX_LINE_QUANTITY, 'A quantity is a whole number from 1 to 100.')
			})
		)
		.min(1, 'A sale needs at least one piece.')
		.max(50, 'A sale holds at most 50 lines.')
		.refine(
			(ls) => ls.reduce((a, l) => a + l.quantity, 0) <= MAX_SALE_PIECES,
			`One sale holds at most ${MAX_SALE_PIECES} pieces; split it into several sales.`
		)
		.refine(
			(ls) => new Set(ls.map((l) => `${l.pieceSlug}/${l.woodSlug}`)).size === ls.length,
			'The same piece is on two lines; put it on one line with its count.'
		),
	discountMinor: z
		.number()
		.int('The discount must be whole cents.')
		.min(0, 'The discount cannot be negative.')
		.default(0),
	method: z.enum(['cash', 'card', 'other'], { error: 'Pay by cash, card or other.' }),
	tenderedMinor: z.number().int().min(0).max(100_000_000).nullable().optional(),
	/** A split payment: this much of a cash sale went on the card. */
	cardPartMinor: z
		.number()
		.int('The card part must be whole cents.')
		.min(1, 'The card part must be more than nothing.')
		.max(100_000_000)
		.nullable()
		.optional(),
	receiptEmail: z
		.string()
		.trim()
		.toLowerCase()
		.max(255, 'That e-mail address is too long.')
		.pipe(
			z.union([z.literal(''), z.email('The receipt address does not look like an e-mail address.')])
		)
		.optional()
});
export type BoothSale = z.infer<typeof boothSaleSchema>;

/** The batch shell only: entries are checked one by one so a broken one spares the rest. */
export const boothBatchSchema = z.object({
	sales: z.array(z.unknown(), { error: 'Send { sales: [...] }.' })
});

export const boothOrderSchema = z
	.object({
		id: clientId,
		at: z.iso.datetime({ offset: true }),
		pieceSlug: slug,
		woodSlug: slug,
		initials: z
			.string()
			.trim()
			.min(1, 'Enter the initials to carve.')
			.max(3, 'At most three initials.')
			.regex(/^[A-Za-z&]+$/, 'Initials are letters (and &).'),
		name: text('the buyer’s name', 120),
		email: emailAddress,
		line1: z.string().trim().max(120, 'Keep the street address under 120 characters.').default(''),
		city: z.string().trim().max(80, 'Keep the town under 80 characters.').default(''),
		region: z.string().trim().max(80).optional(),
		postcode: z.string().trim().max(12, 'Keep the postcode under 12 characters.').default(''),
		country: z.string().trim().toUpperCase().length(2, 'Country as two letters, like US.'),
		depositMinor: z.number().int().min(0, 'The deposit cannot be negative.').max(100_000_000),
		method: z.enum(['cash', 'card', 'other']),
		delivery: z.enum(['post', 'collect']).default('post')
	})
	.superRefine((o, ctx) => {
		if (o.delivery !== 'post') return;
		for (const [k, label] of [
			['line1', 'the street address'],
			['city', 'the town'],
			['postcode', 'the postcode']
		] as const)
			if (!o[k]) ctx.addIssue({ code: 'custom', path: [k], message: `Enter ${label} to post it.` });
	});
export type BoothOrder = z.infer<typeof boothOrderSchema>;

/** A void (or refund) of a booth sale, made on the phone and queued like a sale. */
export const boothVoidSchema = z.object({
	id: clientId,
	saleId: clientId,
	at: z.iso.datetime({ offset: true, error: 'The void time must be an ISO date and time.' }),
	reason: text('the reason for the void', 300)
});
export type BoothVoid = z.infer<typeof boothVoidSchema>;

/** A refused entry the helper threw away on the phone; the owner still sees it. */
export const boothDiscardSchema = z.object({
	id: clientId,
	kind: z.enum(['sale', 'deposit']),
	summary: z.string().trim().min(1).max(500),
	reason: z.string().trim().min(1).max(500)
});

export const tallyFormSchema = z.object({
	cashCounted: moneyField('the cash counted'),
	cashPaidOut: moneyField('the cash paid out'),
	cardReported: z.string().trim().optional()
});

export const countSchema = wholeCount('the count');
