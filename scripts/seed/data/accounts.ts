/** The demo's three accounts, as plain data (the e2e helpers and the bench sign in with them). */
import type { Role } from '../../../src/lib/server/db/schema';

/** Demo-only accounts, listed in the README and printed by `npm start`. */
export const DEMO_ACCOUNTS: { email: string; password: string; name: string; role: Role }[] = [
	{
		email: 'hollis@chipstall.test',
		password: 'demo-owner-2026',
		name: 'Hollis Marsh',
		role: 'owner'
	},
	{
		email: 'wren@chipstall.test',
		password: 'demo-helper-2026',
		name: 'Wren Tolliver',
		role: 'helper'
	},
	{
		email: 'juniper@example.test',
		password: 'demo-customer-2026',
		name: 'Juniper Vale',
		role: 'customer'
	}
];
