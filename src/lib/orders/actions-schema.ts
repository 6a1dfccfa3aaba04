import { z } from 'zod';
import { orderStatuses } from '$lib/orders/status';
import { plain } from '../forms/plain-text';

/** A status move from the order page: where to, and (optionally) why. */
export const moveSchema = z.object({
	to: z.enum(orderStatuses, { error: 'Choose a status.' }),
	why: plain(z.string().trim().max(300, 'Keep the reason under 300 characters.'))
		.optional()
		.default(''),
	/** The status the page showed: a second click of the same button finds it moved already. */
	expect: z.enum(orderStatuses).optional()
});

/** An internal note on an order. */
export const noteSchema = z.object({
	body: plain(
		z
			.string({ error: 'Write the note first.' })
			.trim()
			.min(1, 'Write the note first.')
			.max(2000, 'Keep a note under 2,000 characters.'),
		true
	)
});

/** Cancelling an order or taking it a step back: a reason is required, kept in the history. */
export const steerSchema = z.object({
	reason: plain(
		z
			.string({ error: 'Say why, in a few words.' })
			.trim()
			.min(3, 'Say why, in a few words.')
			.max(300, 'Keep the reason under 300 characters.')
	),
	expect: z.enum(orderStatuses, { error: 'Reload the page: the order’s status is missing.' })
});
