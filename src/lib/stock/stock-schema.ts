import { z } from 'zod';
import { plain } from '../forms/plain-text';

/** Where stock sits: the workshop shelf or one fair's booth (`fair:<id>`). */
export const stockPlace = z
	.string({ error: 'Choose where the pieces are.' })
	.regex(/^(workshop|fair:[1-9]\d{0,9})$/, 'Choose where the pieces are.')
	.transform((s) => s as 'workshop' | `fair:${number}`);

/**
 * A stock change from the piece page: add or take away a whole number of pieces of one wood at
 * one place, always with a reason (it is kept beside the change, with who made it).
 */
export const stockAdjustForm = z.object({
	woodId: z.coerce
		.number({ error: 'Choose the wood.' })
		.int('Choose the wood.')
		.positive('Choose the wood.'),
	place: stockPlace,
	direction: z.enum(['add', 'remove'], { error: 'Say whether pieces come in or go out.' }),
	count: z
		.string({ error: 'Enter how many pieces.' })
		.trim()
		.regex(/^\d+$/, 'Enter a whole number of pieces, like 2.')
		.transform(Number)
		.pipe(
			z
				.number()
				.int()
				.min(1, 'Enter at least 1 piece.')
				.max(1000, 'At most 1,000 pieces in one change.')
		),
	reason: plain(
		z
			.string({ error: 'Say why the count changes.' })
			.trim()
			.min(3, 'Say why the count changes (e.g. "Carved two more").')
			.max(160, 'Keep the reason under 160 characters.')
	)
});
export type StockAdjustForm = z.infer<typeof stockAdjustForm>;

/** The signed change a form asks for. */
export const stockDelta = (f: Pick<StockAdjustForm, 'direction' | 'count'>) =>
	f.direction === 'add' ? f.count : -f.count;
