import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { passwordResets, sessions, users } from '$lib/server/db/schema';
import { createSessionFor, validateToken } from '$lib/server/auth/lucia';
import { authenticate, createAccount } from '$lib/server/auth/users';
import {
	RESET_LIFETIME_MS,
	checkResetToken,
	completeReset,
	createResetToken
} from '$lib/server/auth/reset';

const sha256Hex = (s: string) => createHash('sha256').update(s).digest('hex');
const HOUR = 60 * 60 * 1000;

let userId: string;
const email = `reset-${crypto.randomUUID()}@example.test`;

beforeAll(async () => {
	const made = await createAccount({ name: 'Rhea Reset', email, password: 'first password' });
	if (!made.ok) throw new Error('could not create the test account');
	userId = made.user.id;
});

afterAll(async () => {
	await db.delete(users).where(eq(users.id, userId));
	await db.$client.end();
});

describe('password reset tokens', () => {
	it('makes no token for an e-mail without an account', async () => {
		expect(await createResetToken(`nobody-${crypto.randomUUID()}@example.test`)).toBeNull();
	});

	it('stores only the SHA-256 of the token, expiring one hour later', async () => {
		const now = new Date('2030-05-01T10:00:00Z');
		const made = await createResetToken(email, now);
		expect(made).not.toBeNull();
		const [row] = await db
			.select()
			.from(passwordResets)
			.where(eq(passwordResets.id, sha256Hex(made!.token)));
		expect(row.userId).toBe(userId);
		expect(row.usedAt).toBeNull();
		expect(RESET_LIFETIME_MS).toBe(HOUR);
		expect(row.expiresAt.toISOString()).toBe('2030-05-01T11:00:00.000Z');
		const all = await db.select({ id: passwordResets.id }).from(passwordResets);
		expect(all.map((r) => r.id)).not.toContain(made!.token);
	});

	it('is valid just before the hour is up and expired just after', async () => {
		const now = new Date();
		const { token } = (await createResetToken(email, now))!;
		expect(await checkResetToken(token, new Date(now.getTime() + HOUR - 60_000))).toBe('valid');
		expect(await checkResetToken(token, new Date(now.getTime() + HOUR + 60_000))).toBe('expired');
		const late = await completeReset(
			token,
			'too late password',
			new Date(now.getTime() + HOUR + 1000)
		);
		expect(late).toEqual({ ok: false, state: 'expired' });
	});

	it('reports an unknown token', async () => {
		expect(await checkResetToken('no-such-token')).toBe('unknown');
		expect(await completeReset('no-such-token', 'whatever password')).toEqual({
			ok: false,
			state: 'unknown'
		});
	});

	it('sets the new password, ends old sessions, and works only once', async () => {
		const oldToken = await createSessionFor(userId);
		const { token } = (await createResetToken(email))!;
		const other = (await createResetToken(email))!;

		const first = await completeReset(token, 'second password');
		expect(first).toEqual({ ok: true, userId });
		expect(await authenticate(email, 'second password')).not.toBeNull();
		expect(await authenticate(email, 'first password')).toBeNull();
		expect((await validateToken(oldToken)).session).toBeNull();
		expect(await db.select().from(sessions).where(eq(sessions.userId, userId))).toHaveLength(0);

		expect(await checkResetToken(token)).toBe('used');
		expect(await completeReset(token, 'third password')).toEqual({ ok: false, state: 'used' });
		// Any other link sent before the reset is spent with it.
		expect(await checkResetToken(other.token)).toBe('used');
		expect(await authenticate(email, 'second password')).not.toBeNull();
	});

	it('lets only one of two simultaneous uses of a link through', async () => {
		const { token } = (await createResetToken(email))!;
		const results = await Promise.all([
			completeReset(token, 'racer one password'),
			completeReset(token, 'racer two password')
		]);
		expect(results.filter((r) => r.ok)).toHaveLength(1);
		expect(results.filter((r) => !r.ok)).toEqual([{ ok: false, state: 'used' }]);
	});
});
