import { z } from 'zod';
import { plain } from '../forms/plain-text';

/** A buyer's message to the shop about one order, from the order page. */
export const orderMessageSchema = z.object({
	body: plain(
		z
			.string({ error: 'Write your message first.' })
			.trim()
			.min(3, 'Write your message first.')
			.max(2000, 'Keep the message under 2,000 characters.'),
		true
	)
});
