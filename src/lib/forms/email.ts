import { z } from 'zod';

/**
 * An e-mail address as every form takes it: trimmed and lower-cased before it is stored, so
 * "Juniper@Example.test " finds the same account and gathers the same guest orders.
 */
export const emailAddress = z
	.string({ error: 'Enter your e-mail address.' })
	.trim()
	.toLowerCase()
	.min(1, 'Enter your e-mail address.')
	.max(255, 'That e-mail address is too long.')
	.pipe(z.email('That does not look like an e-mail address.'));
