import crypto from 'node:crypto';

/** Stripe-style ids: a prefix and random base62-ish text, e.g. cs_test_a1B2…, pi_3Q…. */
export function newId(prefix: string, length = 24) {
	const alphabet = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';
	const bytes = crypto.randomBytes(length);
	let out = '';
	for (const b of bytes) out += alphabet[b % alphabet.length];
	return `${prefix}_${out}`;
}
