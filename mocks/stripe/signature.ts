import Stripe from 'stripe';

// The SDK's own helper signs, so the stand-in follows the scheme the SDK verifies
// (`Stripe-Signature: t=<unix seconds>,v1=<HMAC-SHA256 hex>`) without a copy of it here.
const sdk = new Stripe('sk_test_stand_in_signer');

export function signatureHeader(
	payload: string,
	secret: string,
	timestamp = Math.floor(Date.now() / 1000)
) {
	return sdk.webhooks.generateTestHeaderString({ payload, secret, timestamp });
}
