import { z } from 'zod';
import { plain } from '../forms/plain-text';
import { parseMajor } from '$lib/locale/money';

/** What the domain needs: an amount in minor units (null = everything left), why, and restock. */
export type RefundInput = { amountMinor: number | null; reason: string; restock: boolean };

/**
 * The owner's refund form: "all that is left" or a part typed in the order's currency
 * (e.g. 12.50), a reason the buyer will read, and whether the piece came back.
 */
export function refundFormSchema(currency: string) {
	return z
		.object({
			kind: z.enum(['full', 'part'], { error: 'Choose a full or a part refund.' }),
			amount: z.string().optional().default(''),
			reason: plain(
				z
					.string()
					.trim()
					.min(3, 'Say why, in a few words: the buyer reads this.')
					.max(300, 'Keep the reason under 300 characters.')
			),
			restock: z
				.string()
				.optional()
				.transform((v) => v === 'on' || v === 'true')
		})
		.transform((v, ctx): RefundInput => {
			if (v.kind === 'full') return { amountMinor: null, reason: v.reason, restock: v.restock };
			const minor = parseMajor(v.amount, currency);
			if (minor === null || minor < 1) {
				ctx.addIssue({
					code: 'custom',
					path: ['amount'],
					message: 'Type the amount to refund, e.g. 12.50.'
				});
				return z.NEVER;
			}
			return { amountMinor: minor, reason: v.reason, restock: v.restock };
		});
}
