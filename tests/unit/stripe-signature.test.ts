import crypto from 'node:crypto';
import Stripe from 'stripe';
import { describe, expect, it } from 'vitest';
import { signatureHeader } from '../../mocks/stripe/signature';

// The official `stripe` SDK's verifier is the reference for the signature scheme: what our
// stand-in signs must pass `stripe.webhooks.constructEvent`, and a tampered payload must not.
const sdk = new Stripe('sk_test_unused');

describe('stand-in webhook signatures', () => {
	it('reproduces the published check vector (TRADE.md, computed with the SDK verifier)', () => {
		// Source: Stripe docs "Check the webhook signatures" scheme (v1 = HMAC-SHA256 of
		// `${t}.${payload}`, hex); vector from TRADE.md.
		const vector = '8042376f6ca064adbe037642a718227dfd59047137eb49497a54c49eb0cfb724';
		const payload = '{"id":"evt_test","object":"event"}';
		const hmac = crypto
			.createHmac('sha256', 'whsec_test_secret')
			.update(`1700000000.${payload}`, 'utf8')
			.digest('hex');
		expect(hmac).toBe(vector);
		expect(signatureHeader(payload, 'whsec_test_secret', 1700000000)).toBe(
			`t=1700000000,v1=${vector}`
		);
	});

	it('matches the SDK test-header generator byte for byte', () => {
		const payload = JSON.stringify({
			id: 'evt_x',
			object: 'event',
			type: 'checkout.session.completed'
		});
		const t = 1712345678;
		// Reference: stripe.webhooks.generateTestHeaderString from the official SDK.
		const reference = sdk.webhooks.generateTestHeaderString({
			payload,
			secret: 'whsec_abc',
			timestamp: t
		});
		expect(signatureHeader(payload, 'whsec_abc', t)).toBe(reference);
	});

	it('verifies with the SDK constructEvent; a tampered payload or wrong secret does not', () => {
		const payload = JSON.stringify({
			id: 'evt_1',
			object: 'event',
			type: 'checkout.session.completed',
			data: { object: { amount_total: 9000 } }
		});
		const header = signatureHeader(payload, 'whsec_chipstall');
		const event = sdk.webhooks.constructEvent(payload, header, 'whsec_chipstall');
		expect(event.id).toBe('evt_1');

		const tampered = payload.replace('9000', '1');
		expect(() => sdk.webhooks.constructEvent(tampered, header, 'whsec_chipstall')).toThrow(
			Stripe.errors.StripeSignatureVerificationError
		);
		expect(() => sdk.webhooks.constructEvent(payload, header, 'whsec_other')).toThrow(
			Stripe.errors.StripeSignatureVerificationError
		);
	});

	it('an old timestamp is refused by the SDK (default tolerance 300 s, per Stripe docs)', () => {
		const payload = '{"id":"evt_old","object":"event"}';
		const old = signatureHeader(payload, 'whsec_chipstall', Math.floor(Date.now() / 1000) - 301);
		expect(() => sdk.webhooks.constructEvent(payload, old, 'whsec_chipstall')).toThrow(
			/tolerance/i
		);
	});
});
