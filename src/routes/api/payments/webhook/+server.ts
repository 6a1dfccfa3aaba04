import { json } from '@sveltejs/kit';
import { orApiError } from '$lib/server/http/api-errors';
import { config } from '$lib/server/config';
import { verifyWebhook } from '$lib/server/orders/stripe';
import { handlePaymentEvent } from '$lib/server/orders/payment';
import type { RequestHandler } from './$types';

/**
 * Payment provider events. The raw body is verified with the SDK before anything is read (so
 * this route alone reads text, not `readJson`); a refused signature or event answers 400.
 */
export const POST: RequestHandler = ({ request }) =>
	orApiError(async () => {
		const raw = await request.text();
		const event = verifyWebhook(raw, request.headers.get('stripe-signature'));
		return json({ received: true, ...(await handlePaymentEvent(event, config.origin)) });
	});
