import Stripe from 'stripe';
import { config } from '../config';
import { DomainError } from '../errors/domain-error';

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

/** How far a signed event's timestamp may be from our clock, either way (the SDK's default). */
export const WEBHOOK_TOLERANCE_S = 300;

/**
 * Checks a webhook's `Stripe-Signature` against the raw body with the SDK's own verifier and
 * returns the event. The SDK refuses a timestamp older than the tolerance; one from the future
 * (a replay signed with a skewed or forged clock) is refused here too. Throws a DomainError 400
 * (code `signature`) when the signature is missing, wrong, too old or too new, with the reason.
 */
export function verifyWebhook(
	rawBody: string | Buffer,
	signatureHeader: string | null,
	now = Date.now()
): Stripe.Event {
	const refused = (reason: string) =>
		new DomainError(400, `The signature was not accepted: ${reason}`, { code: 'signature' });
	if (!signatureHeader) throw refused('Missing Stripe-Signature header');
	const t = Number(/(?:^|,)\s*t=(\d+)/.exec(signatureHeader)?.[1]);
	if (Number.isFinite(t) && t - now / 1000 > WEBHOOK_TOLERANCE_S) {
		throw refused('The signature timestamp is in the future beyond the tolerance.');
	}
	try {
		return stripe().webhooks.constructEvent(
			rawBody,
			signatureHeader,
			config.stripe.webhookSecret,
			WEBHOOK_TOLERANCE_S,
			undefined,
			now
		);
	} catch (err) {
		throw refused((err as Error).message);
	}
}

export type { Stripe };
