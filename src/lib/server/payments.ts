import Stripe from 'stripe';
import { config } from './config';

let client: Stripe | undefined;

/**
 * The official Stripe SDK. Host, port and protocol are passed only when configured: locally
 * they point at mocks/stripe; production leaves them empty and the SDK uses Stripe's API.
 */
export function stripe(): Stripe {
	if (client) return client;
	const { host, port, protocol } = config.stripe;
	client = new Stripe(config.stripe.secretKey, {
		...(host ? { host } : {}),
		...(port ? { port } : {}),
		...(protocol ? { protocol } : {}),
		maxNetworkRetries: 2
	});
	return client;
}

export class WebhookSignatureError extends Error {}

/**
 * Checks a webhook's `Stripe-Signature` against the raw body with the SDK's own verifier
 * (default 300 s tolerance) and returns the event. Throws WebhookSignatureError when the
 * signature is missing, wrong or too old, so the route can answer 400.
 */
export function verifyWebhook(
	rawBody: string | Buffer,
	signatureHeader: string | null
): Stripe.Event {
	if (!signatureHeader) throw new WebhookSignatureError('Missing Stripe-Signature header');
	try {
		return stripe().webhooks.constructEvent(rawBody, signatureHeader, config.stripe.webhookSecret);
	} catch (err) {
		throw new WebhookSignatureError((err as Error).message);
	}
}

export type { Stripe };
