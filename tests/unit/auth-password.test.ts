import { describe, expect, it } from 'vitest';
import { hashPassword, verifyPassword } from '$lib/server/auth/password';

describe('password hashing', () => {
	it('produces an argon2id PHC string with the OWASP parameters', async () => {
		const hash = await hashPassword('walnut-and-cherry');
		// PHC string format for Argon2 (RFC 9106 names the variant "argon2id"; v=19 is version 0x13).
		expect(hash.startsWith('$argon2id$v=19$')).toBe(true);
		// OWASP Password Storage Cheat Sheet: argon2id, m=19456 (19 MiB), t=2, p=1.
		expect(hash).toContain('$m=19456,t=2,p=1$');
	});

	it('salts every hash, so the same password never gives the same string', async () => {
		const [a, b] = await Promise.all([
			hashPassword('same-password'),
			hashPassword('same-password')
		]);
		expect(a).not.toBe(b);
	});

	it('verifies the right password and rejects a wrong one', async () => {
		const hash = await hashPassword('basswood rosette');
		expect(await verifyPassword(hash, 'basswood rosette')).toBe(true);
		expect(await verifyPassword(hash, 'basswood rosettE')).toBe(false);
		expect(await verifyPassword(hash, '')).toBe(false);
	});

	it('treats a stored value that is not a hash as a mismatch, not a crash', async () => {
		expect(await verifyPassword('not-a-hash', 'anything')).toBe(false);
		expect(await verifyPassword('', 'anything')).toBe(false);
	});
});
