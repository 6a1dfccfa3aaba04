import { z } from 'zod';
import { orderStatuses } from '$lib/order-status';

/** A status move from the order page: where to, and (optionally) why. */
export const moveSchema = z.object({
	to: z.enum(orderStatuses, { error: 'Choose a status.' }),
	why: z.string().trim().max(300, 'Keep the reason under 300 characters.').optional().default('')
});

/** An internal note on an order. */
export const noteSchema = z.object({
	body: z
		.string({ error: 'Write the note first.' })
		.trim()
		.min(1, 'Write the note first.')
		.max(2000, 'Keep a note under 2,000 characters.')
});
