/**
 * Where each carrier publishes its tracking page. A carrier not in the list is still accepted
 * (a local courier); the buyer then gets the number without a link.
 */
import { CARRIER_NAMES } from '$lib/orders/carriers';

export type Carrier = { id: string; name: string; trackUrl: (n: string) => string };

export const CARRIERS: Carrier[] = [
	{
		id: 'usps',
		name: 'USPS',
		trackUrl: (n) => `https://tools.usps.com/go/TrackConfirmAction?tLabels=${n}`
	},
	{ id: 'ups', name: 'UPS', trackUrl: (n) => `https://www.ups.com/track?tracknum=${n}` },
	{ id: 'fedex', name: 'FedEx', trackUrl: (n) => `https://www.fedex.com/fedextrack/?trknbr=${n}` },
	{
		id: 'dhl',
		name: 'DHL',
		trackUrl: (n) =>
			`https://www.dhl.com/global-en/home/tracking/tracking-express.html?submit=1&tracking-id=${n}`
	},
	{
		id: 'royal-mail',
		name: 'Royal Mail',
		trackUrl: (n) => `https://www.royalmail.com/track-your-item#/tracking-results/${n}`
	},
	{
		id: 'canada-post',
		name: 'Canada Post',
		trackUrl: (n) =>
			`https://www.canadapost-postescanada.ca/track-reperage/en#/search?searchFor=${n}`
	}
];

const norm = (s: string) => s.toLowerCase().replace(/[^a-z0-9]/g, '');

export function findCarrier(name: string): Carrier | undefined {
	const key = norm(name);
	return CARRIERS.find((c) => norm(c.id) === key || norm(c.name) === key);
}

/** Tracking numbers are letters and digits; spaces and dashes people type are dropped. */
/** Every carrier the form suggests has a tracking page here (checked once, at load). */
for (const n of CARRIER_NAMES) if (!CARRIERS.some((c) => c.name === n)) throw new Error(n);

export function cleanTrackingNumber(raw: string): string {
	return raw.replace(/[\s-]/g, '').toUpperCase();
}

/** The carrier's public tracking page for a number, or null when it publishes no pattern. */
export function trackingLink(carrier: string, trackingNumber: string): string | null {
	const c = findCarrier(carrier);
	return c ? c.trackUrl(encodeURIComponent(cleanTrackingNumber(trackingNumber))) : null;
}
