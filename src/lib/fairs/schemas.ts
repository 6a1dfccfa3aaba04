import { z } from 'zod';
import { requiredText } from '$lib/forms/required-text';
import { parseMajor, parsePercent } from '$lib/locale/money';

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
		name: requiredText('the fair’s name', 120),
		place: requiredText('where it is', 160),
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

export const tallyFormSchema = z.object({
	cashCounted: moneyField('the cash counted'),
	cashPaidOut: moneyField('the cash paid out'),
	cardReported: z.string().trim().optional()
});

export const countSchema = wholeCount('the count');
