import { Lucia, TimeSpan } from 'lucia';
import { DrizzleMySQLAdapter } from '@lucia-auth/adapter-drizzle';
import type { Cookies } from '@sveltejs/kit';
import { db } from '../db';
import { sessions, users, type Role } from '../db/schema';
import { config } from '../config';
import { generateToken, hashToken } from './token';

const adapter = new DrizzleMySQLAdapter(db, sessions, users);

export const lucia = new Lucia(adapter, {
	sessionExpiresIn: new TimeSpan(30, 'd'),
	sessionCookie: {
		name: 'chipstall_session',
		// `secure` is decided per request (below): an https request gets a Secure cookie even
		// when ORIGIN was not set to https (OWASP ASVS 4.0 V3.4.1).
		attributes: { sameSite: 'lax', secure: config.origin.startsWith('https:') }
	},
	// Only what pages may see: never the password hash.
	getUserAttributes: (row) => ({ email: row.email, name: row.name, role: row.role })
});

declare module 'lucia' {
	interface Register {
		Lucia: typeof lucia;
		DatabaseUserAttributes: { email: string; name: string; role: Role };
	}
}

/**
 * Starts a session and returns the token for the cookie. The session row's id is the token's
 * SHA-256, so a leaked sessions table cannot be replayed as cookies.
 */
export async function createSessionFor(userId: string): Promise<string> {
	const token = generateToken();
	await lucia.createSession(userId, {}, { sessionId: hashToken(token) });
	return token;
}

/** The session and user behind a cookie token, or nulls. `session.fresh` means "re-send the cookie". */
export function validateToken(token: string) {
	return lucia.validateSession(hashToken(token));
}

/** Ends one session, by its stored id (the token hash). */
export function invalidateSession(sessionId: string): Promise<void> {
	return lucia.invalidateSession(sessionId);
}

/** Ends every session of a user: after a password reset, or when a helper is removed. */
export function invalidateUserSessions(userId: string): Promise<void> {
	return lucia.invalidateUserSessions(userId);
}

/**
 * The cookie carries the token (lucia serialises whatever value it is given). `https` is whether
 * this request came over https: then the cookie is Secure, whatever ORIGIN says.
 */
export function setSessionCookie(cookies: Cookies, token: string, https: boolean): void {
	const cookie = lucia.createSessionCookie(token);
	cookies.set(cookie.name, cookie.value, {
		path: '/',
		...cookie.attributes,
		secure: cookie.attributes.secure || https
	});
}

export function clearSessionCookie(cookies: Cookies, https: boolean): void {
	const cookie = lucia.createBlankSessionCookie();
	cookies.set(cookie.name, cookie.value, {
		path: '/',
		...cookie.attributes,
		secure: cookie.attributes.secure || https
	});
}

/** Signs a user in on this response: new session, cookie set. */
export async function signIn(cookies: Cookies, userId: string, https: boolean): Promise<void> {
	setSessionCookie(cookies, await createSessionFor(userId), https);
}

export const sessionCookieName = lucia.sessionCookieName;
