/**
 * Demo shop details: Hollis Marsh's workshop address in the invented town of Linden Ford, a
 * contact address, no closed dates, and the returns window. Relative imports only (runs under tsx).
 */
import * as schema from '../../src/lib/server/db/schema';
import type { SeedDb } from './extras';

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

export async function seedSettings(tx: SeedTx) {
	await tx.insert(schema.settings).values([
		{ key: 'shop', value: DEMO_SHOP },
		{ key: 'away', value: { until: '', note: '' } },
		{ key: 'policies', value: { returnsDays: 30, extra: '' } }
	]);
}
