import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { sessions, users } from '$lib/server/db/schema';
import {
	createSessionFor,
	invalidateSession,
	invalidateUserSessions,
	validateToken
} from '$lib/server/auth/lucia';
import { createAccount } from '$lib/server/auth/users';

/** Reference digest from Node's own crypto, independent of the app's token module. */
const sha256Hex = (s: string) => createHash('sha256').update(s).digest('hex');

let userId: string;
const email = `session-${crypto.randomUUID()}@example.test`;

beforeAll(async () => {
	const made = await createAccount({ name: 'Ada Session', email, password: 'a long password' });
	if (!made.ok) throw new Error('could not create the test account');
	userId = made.user.id;
});

afterAll(async () => {
	await db.delete(users).where(eq(users.id, userId));
	await db.$client.end();
});

describe('sessions', () => {
	it('stores only the SHA-256 hex of the cookie token as the session id', async () => {
		const token = await createSessionFor(userId);
		const rows = await db.select().from(sessions).where(eq(sessions.userId, userId));
		const ids = rows.map((r) => r.id);
		expect(ids).toContain(sha256Hex(token));
		expect(ids).not.toContain(token);
		expect(sha256Hex(token)).toMatch(/^[0-9a-f]{64}$/);
	});

	it('gives tokens of at least 128 random bits that differ every time', async () => {
		const a = await createSessionFor(userId);
		const b = await createSessionFor(userId);
		expect(a).not.toBe(b);
		// base32 carries 5 bits per character: 32 characters = 160 bits.
		expect(a.length * 5).toBeGreaterThanOrEqual(128);
	});

	it('validates a token to its user, exposing no password hash', async () => {
		const token = await createSessionFor(userId);
		const { session, user } = await validateToken(token);
		expect(session?.id).toBe(sha256Hex(token));
		expect(user).toEqual({ id: userId, email, name: 'Ada Session', role: 'customer' });
		expect(user).not.toHaveProperty('passwordHash');
		// 30 days from now, to within the second the datetime column keeps.
		const days = (session!.expiresAt.getTime() - Date.now()) / 86_400_000;
		expect(days).toBeGreaterThan(29.99);
		expect(days).toBeLessThanOrEqual(30);
	});

	it('does not accept the stored hash itself as a cookie value', async () => {
		const token = await createSessionFor(userId);
		const { session } = await validateToken(sha256Hex(token));
		expect(session).toBeNull();
	});

	it('ends one session, then all sessions of the user', async () => {
		const one = await createSessionFor(userId);
		const two = await createSessionFor(userId);
		await invalidateSession(sha256Hex(one));
		expect((await validateToken(one)).session).toBeNull();
		expect((await validateToken(two)).session).not.toBeNull();
		await invalidateUserSessions(userId);
		expect((await validateToken(two)).session).toBeNull();
		expect(await db.select().from(sessions).where(eq(sessions.userId, userId))).toHaveLength(0);
	});

	it('refuses an expired session and removes it', async () => {
		const token = await createSessionFor(userId);
		await db
			.update(sessions)
			.set({ expiresAt: new Date(Date.now() - 1000) })
			.where(eq(sessions.id, sha256Hex(token)));
		expect((await validateToken(token)).session).toBeNull();
		expect(
			await db
				.select()
				.from(sessions)
				.where(eq(sessions.id, sha256Hex(token)))
		).toHaveLength(0);
	});
});
