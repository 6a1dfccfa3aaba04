import { json } from '@sveltejs/kit';
import { apiError } from '$lib/server/http/api-errors';
import { config } from '$lib/server/config';
import { verifyWebhook, WebhookSignatureError } from '$lib/server/orders/stripe';
import { handlePaymentEvent, PaymentEventError } from '$lib/server/orders/payment';
import type { RequestHandler } from './$types';

/** Payment provider events. The raw body is verified with the SDK before anything is read. */
export const POST: RequestHandler = async ({ request }) => {
	const raw = await request.text();
	let event;
	try {
		event = verifyWebhook(raw, request.headers.get('stripe-signature'));
	} catch (err) {
		if (err instanceof WebhookSignatureError)
			return apiError(400, `The signature was not accepted: ${err.message}`);
		throw err;
	}
	try {
		const result = await handlePaymentEvent(event, config.origin);
		return json({ received: true, ...result });
	} catch (err) {
		if (err instanceof PaymentEventError) return apiError(400, err.message);
		throw err;
	}
};
