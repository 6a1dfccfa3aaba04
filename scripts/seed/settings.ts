/**
 * Demo shop details: Hollis Marsh's workshop address in the invented town of Linden Ford, a
 * contact address, no closed dates, and the returns window. Relative imports only (runs under tsx).
 */
import * as schema from '../../src/lib/server/db/schema';
import type { SeedDb } from './types';
import type { ShopFormat, ShopWords } from '../../src/lib/locale/shop-format';

type SeedTx = Parameters<Parameters<SeedDb['transaction']>[0]>[0];

export const DEMO_SHOP = {
	name: 'Chipstall — Hollis Marsh, chip carver',
	email: 'hollis@chipstall.test',
	address: {
		name: 'Chipstall workshop',
		line1: '14 Millrace Lane',
		line2: '',
		city: 'Linden Ford',
		region: 'VT',
		postcode: '05099',
		country: 'US'
	}
};

/** Linden Ford is in Vermont: the workshop keeps US Eastern time (IANA America/New_York). */
export const DEMO_FORMAT: ShopFormat = {
	timeZone: 'America/New_York',
	locale: 'en-US',
	currency: 'USD'
};

/** The words e-mails and piece pages use for the demo shop. */
export const DEMO_WORDS: ShopWords = {
	owner: 'Hollis',
	town: 'Linden Ford',
	signOff: 'With thanks from Hollis at the Linden Ford workshop'
};

export async function seedSettings(tx: SeedTx) {
	await tx.insert(schema.settings).values([
		{ key: 'format', value: DEMO_FORMAT },
		{ key: 'workshop', value: DEMO_WORDS },
		{ key: 'shop', value: DEMO_SHOP },
		{ key: 'away', value: { until: '', note: '' } },
		{ key: 'policies', value: { returnsDays: 30, extra: '' } }
	]);
}
