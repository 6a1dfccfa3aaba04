/**
 * Production refuses the public local secrets. Source: OWASP ASVS 4.0 V14.1 (build and deploy:
 * no default credentials) and V2.10.4 (secrets are not in source); the defaults listed here are
 * the ones README.md and .env.example publish.
 */
import { describe, expect, it } from 'vitest';
import { isProduction, secretProblems } from '$lib/server/http/secrets-check';

const REAL = {
	STRIPE_SECRET_KEY: 'sk_live_x9Q2rT',
	STRIPE_WEBHOOK_SECRET: 'whsec_4bN8pQz',
	LINK_SECRET: 'c1f0e6b5d3a24f8c9e7b6a5d4c3b2a19',
	S3_ACCESS_KEY_ID: 'AKIAEXAMPLE7',
	S3_SECRET_ACCESS_KEY: 'wJalrXUtnFEMI/K7MDENG',
	DB_PASSWORD: 'p4ss-from-the-vault'
};

describe('production start with default secrets (ASVS V14.1)', () => {
	it('is production with NODE_ENV=production or an https ORIGIN, not otherwise', () => {
		expect(isProduction({ NODE_ENV: 'production' })).toBe(true);
		expect(isProduction({ ORIGIN: 'https://shop.example' })).toBe(true);
		expect(isProduction({ ORIGIN: 'http://localhost:3000' })).toBe(false);
		expect(isProduction({})).toBe(false);
	});

	it('names every unset secret, one line each', () => {
		const lines = secretProblems({});
		expect(lines).toHaveLength(6);
		for (const name of Object.keys(REAL)) expect(lines.join('\n')).toContain(name);
	});

	it('names every secret left at its README default', () => {
		const lines = secretProblems({
			STRIPE_SECRET_KEY: 'sk_test_chipstall_local',
			STRIPE_WEBHOOK_SECRET: 'whsec_chipstall_local',
			LINK_SECRET: 'chipstall-local-link-secret',
			S3_ACCESS_KEY_ID: 'S3RVER',
			S3_SECRET_ACCESS_KEY: 'S3RVER',
			DB_PASSWORD: 'chipstall-local'
		});
		expect(lines).toHaveLength(6);
		expect(lines.every((l) => /local default/.test(l))).toBe(true);
	});

	it('reads the database password from DATABASE_URL when that is set', () => {
		const { DB_PASSWORD: _unused, ...rest } = REAL;
		void _unused;
		expect(
			secretProblems({ ...rest, DATABASE_URL: 'mysql://chipstall:chipstall-local@db:3306/shop' })
		).toEqual([expect.stringContaining('DATABASE_URL')]);
		expect(
			secretProblems({ ...rest, DATABASE_URL: 'mysql://chipstall:s3cret@db:3306/shop' })
		).toEqual([]);
	});

	it('has nothing to say when every secret is set', () => {
		expect(secretProblems(REAL)).toEqual([]);
	});
});
