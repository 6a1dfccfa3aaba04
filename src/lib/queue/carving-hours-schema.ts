import { z } from 'zod';

const hoursField = z.coerce
	.number({ error: 'Type the hours as a number, e.g. 4.5.' })
	.min(0, 'Hours cannot be negative.')
	.max(16, 'At most 16 hours in a day.');
const days = (max: number, what: string) =>
	z.coerce
		.number()
		.int(`${what} is a whole number of days.`)
		.min(0)
		.max(max, `${what}: at most ${max} days.`);

/**
 * The owner's carving-hours form: hours per weekday (Sunday first, as the week is stored), days
 * off one per line (a single day or "from to"), finishing and packing days, and the optional
 * surcharge per extra minute in cents.
 */
export const carvingHoursForm = z.object({
	h0: hoursField,
	h1: hoursField,
	h2: hoursField,
	h3: hoursField,
	h4: hoursField,
	h5: hoursField,
	h6: hoursField,
	daysOff: z
		.string()
		.max(20_000)
		.default('')
		.transform((s, ctx) => {
			const out: string[] = [];
			for (const raw of s
				.split('\n')
				.map((l) => l.trim())
				.filter(Boolean)) {
				const m = /^(\d{4}-\d{2}-\d{2})(?:\s*(?:to|–|-{1,2})\s*(\d{4}-\d{2}-\d{2}))?$/.exec(raw);
				if (
					!m ||
					Number.isNaN(Date.parse(m[1])) ||
					(m[2] && (Number.isNaN(Date.parse(m[2])) || m[2] < m[1]))
				) {
					ctx.addIssue({
						code: 'custom',
						message: `“${raw}” is not a day like 2026-03-07 or a range like 2026-03-07 to 2026-03-09.`
					});
					return z.NEVER;
				}
				out.push(m[2] ? `${m[1]}..${m[2]}` : m[1]);
			}
			return out;
		}),
	finishingDays: days(60, 'Finishing'),
	packingDays: days(30, 'Packing'),
	surchargeCents: z.coerce.number().int('Whole cents, please.').min(0).max(10_000).default(0)
});
