import { z } from 'zod';
import { countSchema, moneyField, tallyFormSchema } from '../fairs/schemas';

/** What one save of a day's tally holds, as the server stores it. */
export type TallyCounts = {
	counts: Record<number, number>;
	cashCountedMinor?: number;
	cashPaidOutMinor?: number;
	cardReportedMinor?: number | null;
	/** The fair day counted (default: today, or the fair's nearest day). */
	day?: string;
	/** Made on the phone for each save, so a save resent from its queue is stored once. */
	saveId?: string;
};

/** A day as stored ('YYYY-MM-DD'); anything else is refused before it reaches the database. */
export const tallyDaySchema = z
	.string()
	.regex(/^\d{4}-\d{2}-\d{2}$/, 'Pick one of the fair’s days.');

const saveIdSchema = z.string().min(8).max(36);

/**
 * The tally's fields as typed (count-<fair stock id>, cashCounted, cashPaidOut, and for the owner
 * cardReported) → counts. Each field is checked on its own and its message is issued under its
 * own name, so it sits beside that field on the page and under `fields` in the JSON answer.
 */
export function tallyFieldsSchema(owner: boolean) {
	return z.record(z.string(), z.string()).transform((form, ctx) => {
		let refused = false;
		const refuse = (field: string, message: string) => {
			refused = true;
			ctx.addIssue({ code: 'custom', message, path: [field] });
		};
		const counts: Record<number, number> = {};
		for (const [key, value] of Object.entries(form)) {
			const m = /^count-(\d+)$/.exec(key);
			if (!m || value.trim() === '') continue;
			const n = countSchema.safeParse(value.trim());
			if (n.success) counts[Number(m[1])] = n.data;
			else refuse(key, n.error.issues[0].message);
		}
		const money = tallyFormSchema.safeParse({
			cashCounted: form.cashCounted ?? '',
			cashPaidOut: form.cashPaidOut ?? '',
			cardReported: form.cardReported ?? ''
		});
		if (!money.success) for (const i of money.error.issues) refuse(String(i.path[0]), i.message);
		let cardReportedMinor: number | null | undefined = undefined;
		if (owner && money.success) {
			const raw = money.data.cardReported ?? '';
			const card = moneyField('the card reader’s total').safeParse(raw);
			if (raw === '') cardReportedMinor = null;
			else if (card.success) cardReportedMinor = card.data;
			else refuse('cardReported', card.error.issues[0].message);
		}
		if (!money.success || refused) return z.NEVER;
		const cashGiven = (form.cashCounted ?? '').trim() !== '';
		const counted: TallyCounts = {
			counts,
			cashCountedMinor: cashGiven ? money.data.cashCounted : undefined,
			cashPaidOutMinor: money.data.cashPaidOut,
			cardReportedMinor
		};
		return counted;
	});
}

/**
 * The tally page's form: the fields, plus the day shown and the save's id. A day or id that is
 * not one is left out (the server counts today, or stores the save anew), as before.
 */
export function tallyFormInput(owner: boolean) {
	return z.record(z.string(), z.string()).transform((form, ctx) => {
		const parsed = tallyFieldsSchema(owner).safeParse(form);
		if (!parsed.success) {
			for (const i of parsed.error.issues)
				ctx.addIssue({ code: 'custom', message: i.message, path: i.path });
			return z.NEVER;
		}
		const day = tallyDaySchema.safeParse(form.day);
		const saveId = saveIdSchema.safeParse(form.saveId);
		return {
			...parsed.data,
			day: day.success ? day.data : undefined,
			saveId: saveId.success ? saveId.data : undefined
		};
	});
}

/** What the phone's queue sends to the tally API: the same fields, its day and the save's id. */
export const tallySaveSchema = z.object({
	id: saveIdSchema.optional(),
	day: tallyDaySchema,
	fields: z
		.record(z.string().max(40), z.string().max(40))
		.refine((f) => Object.keys(f).length <= 500, {
			message: 'Too many counts in one save.'
		})
});
