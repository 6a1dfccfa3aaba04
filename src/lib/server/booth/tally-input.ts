import { z } from 'zod';
import { countSchema, moneyField, tallyFormSchema } from '$lib/fairs/schemas';
import type { TallyCounts } from './tally';

/** A day as stored ('YYYY-MM-DD'); anything else is refused before it reaches the database. */
export const tallyDaySchema = z
	.string()
	.regex(/^\d{4}-\d{2}-\d{2}$/, 'Pick one of the fair’s days.');

/** What the tally form sends, as texts: the page's form action and the phone's queue both send this. */
export const tallySaveSchema = z.object({
	id: z.string().min(8).max(36).optional(),
	day: tallyDaySchema,
	fields: z
		.record(z.string().max(40), z.string().max(40))
		.refine((f) => Object.keys(f).length <= 500, {
			message: 'Too many counts in one save.'
		})
});

/**
 * Reads the tally's fields (count-<fair stock id>, cashCounted, cashPaidOut, and for the owner
 * cardReported) into counts; each field is checked on its own so its message sits beside it.
 */
export function parseTallyFields(
	form: Record<string, string>,
	owner: boolean
): { ok: true; data: TallyCounts } | { ok: false; errors: Record<string, string> } {
	const errors: Record<string, string> = {};
	const counts: Record<number, number> = {};
	for (const [key, value] of Object.entries(form)) {
		const m = /^count-(\d+)$/.exec(key);
		if (!m || value.trim() === '') continue;
		const n = countSchema.safeParse(value.trim());
		if (n.success) counts[Number(m[1])] = n.data;
		else errors[key] = n.error.issues[0].message;
	}
	const money = tallyFormSchema.safeParse({
		cashCounted: form.cashCounted ?? '',
		cashPaidOut: form.cashPaidOut ?? '',
		cardReported: form.cardReported ?? ''
	});
	if (!money.success) for (const i of money.error.issues) errors[String(i.path[0])] = i.message;
	let cardReportedMinor: number | null | undefined = undefined;
	if (owner && money.success) {
		const raw = money.data.cardReported ?? '';
		if (raw === '') cardReportedMinor = null;
		else {
			const card = moneyField('the card reader’s total').safeParse(raw);
			if (card.success) cardReportedMinor = card.data;
			else errors.cardReported = card.error.issues[0].message;
		}
	}
	if (Object.keys(errors).length || !money.success) return { ok: false, errors };
	const cashGiven = (form.cashCounted ?? '').trim() !== '';
	return {
		ok: true,
		data: {
			counts,
			cashCountedMinor: cashGiven ? money.data.cashCounted : undefined,
			cashPaidOutMinor: money.data.cashPaidOut,
			cardReportedMinor
		}
	};
}
