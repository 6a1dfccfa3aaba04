import { z } from 'zod';

export const orderRef = z
	.string()
	.trim()
	.toUpperCase()
	.regex(/^[A-Z0-9-]{3,16}$/, 'An order reference looks like CS-7K2M9P.');

export const slipQuery = z.object({
	paper: z
		.enum(['a4', 'letter', 'label'], { error: 'Paper is a4, letter or label.' })
		.default('a4'),
	kind: z.enum(['packing', 'gift'], { error: 'Slip is packing or gift.' }).default('packing')
});

/** `?refs=A,B,C` for the batch: at least one, at most a day's packing, no repeats. */
export const slipBatchQuery = slipQuery.extend({
	refs: z
		.string({ error: 'List the orders as refs=A,B,C.' })
		.transform((s) => [
			...new Set(
				s
					.split(',')
					.map((r) => r.trim())
					.filter(Boolean)
			)
		])
		.pipe(
			z.array(orderRef).min(1, 'List at least one order.').max(100, 'At most 100 orders at once.')
		)
});
