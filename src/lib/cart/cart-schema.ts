import { z } from 'zod';
import { PIECE_SLUG } from '../forms/plain-text';
import { COUNTRIES } from '../locale/countries';

const quantity = z.coerce
	.number({ error: 'Choose how many.' })
	.int('Choose a whole number.')
	.min(1, 'Choose at least one.')
	.max(10, 'At most 10 of one piece per order; write to us for more.');

/** Adding a piece; the personalisation fields are checked again by the pattern schema. */
export const addLineSchema = z.object({
	slug: z
		.string({ error: 'Pick a piece.' })
		.trim()
		.min(1, 'Pick a piece.')
		.max(80, 'Pick a piece from the shop.')
		.regex(PIECE_SLUG, 'Pick a piece from the shop.'),
	wood: z
		.string({ error: 'Choose a wood.' })
		.trim()
		.min(1, 'Choose a wood.')
		.max(40)
		.regex(/^[a-z][a-z-]*$/, 'Choose one of the woods listed.'),
	quantity: quantity.default(1),
	initials: z.string().trim().max(20).optional(),
	style: z.string().trim().max(40).optional()
});

export const setQuantitySchema = z.object({
	lineId: z.coerce
		.number({ error: 'Say which basket line to change.' })
		.int('Unknown basket line.')
		.positive('Unknown basket line.'),
	quantity: z.coerce
		.number({ error: 'Choose how many.' })
		.int('Choose a whole number.')
		.min(0, 'Choose zero (to remove it) or more.')
		.max(10, 'At most 10 of one piece.')
});

export const removeLineSchema = setQuantitySchema.pick({ lineId: true });

export const destinationSchema = z.object({
	country: z
		.string()
		.trim()
		.toUpperCase()
		.regex(/^[A-Z]{2}$/, 'Choose a country.')
});

/** A destination we post to; `message` is what the answer says when we do not post there. */
export const knownDestinationSchema = (message: string) =>
	destinationSchema.refine((d) => (COUNTRIES as readonly string[]).includes(d.country), {
		message,
		path: ['country']
	});
