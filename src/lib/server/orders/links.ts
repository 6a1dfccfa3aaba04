import { createHmac, timingSafeEqual } from 'node:crypto';
import { config } from '../config';

/**
 * A buyer's order page is reachable without an account through a link carrying an HMAC of
 * the order reference, keyed with the link secret. Links do not expire: the page only shows
 * what the confirmation e-mail already said, plus status and tracking.
 */
function mac(ref: string): string {
	return createHmac('sha256', config.linkSecret)
		.update(`order:${ref}`)
		.digest('base64url')
		.slice(0, 32);
}

export function orderPath(ref: string): string {
	return `/orders/${encodeURIComponent(ref)}?k=${mac(ref)}`;
}

export function orderLink(ref: string, origin = config.origin): string {
	return `${origin}${orderPath(ref)}`;
}

export function verifyOrderKey(ref: string, key: string | null): boolean {
	if (!key) return false;
	const expected = Buffer.from(mac(ref));
	const given = Buffer.from(key);
	return given.length === expected.length && timingSafeEqual(given, expected);
}
