import crypto from 'node:crypto';

/**
 * Stripe's published webhook signature scheme: v1 = HMAC-SHA256(secret, `${t}.${payload}`) in hex,
 * sent as `Stripe-Signature: t=<unix seconds>,v1=<hex>`.
 */
export function signatureV1(payload: string, secret: string, timestamp: number) {
	return crypto
		.createHmac('sha256', secret)
		.update(`${timestamp}.${payload}`, 'utf8')
		.digest('hex');
}

export function signatureHeader(
	payload: string,
	secret: string,
	timestamp = Math.floor(Date.now() / 1000)
) {
	return `t=${timestamp},v1=${signatureV1(payload, secret, timestamp)}`;
}
