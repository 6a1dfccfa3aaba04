/**
 * Sign-in, reset and sign-up against the real MariaDB, through the form actions.
 * Sources: OWASP ASVS 4.0 V2.2.1 (anti-automation: throttle guessing per account); the OWASP
 * Authentication Cheat Sheet, "Account Lockout" (a lockout must not let an attacker deny the
 * owner: throttle per account and address, let known devices through — OWASP's "Slow Down
 * Online Guessing Attacks with Device Cookies"), V2.5.2 and
 * the OWASP Authentication Cheat Sheet (the same answer whether or not an account exists),
 * V3.4.1 (Secure cookie attribute); RFC 6585 §4 (429 Too Many Requests, Retry-After).
 */
// A short window, still long enough for 50 password checks on a busy machine.
process.env.THROTTLE_WINDOW_S = '20';

import { describe, expect, it } from 'vitest';
import { isActionFailure, isRedirect } from '@sveltejs/kit';
import { createAccount } from '$lib/server/auth/users';

type Jar = { set: Record<string, { value: string; opts: Record<string, unknown> }> };

function event(
	url: string,
	form: Record<string, string>,
	address = '198.51.100.7',
	cookies: Record<string, string> = {}
) {
	const jar: Jar = { set: {} };
	const locals: Record<string, unknown> = { user: null, session: null };
	return {
		jar,
		locals,
		ev: {
			request: new Request(url, { method: 'POST', body: new URLSearchParams(form) }),
			url: new URL(url),
			locals,
			params: {},
			getClientAddress: () => address,
			cookies: {
				get: (name: string) => cookies[name],
				set: (name: string, value: string, opts: Record<string, unknown>) =>
					(jar.set[name] = { value, opts })
			}
		}
	};
}

/** Runs an action; a thrown redirect comes back as a value. */
async function run(action: (e: never) => unknown, e: unknown) {
	try {
		return await action(e as never);
	} catch (err) {
		if (isRedirect(err)) return err;
		throw err;
	}
}

const unique = (tag: string) =>
	`${tag}-${Date.now()}-${Math.floor(Math.random() * 1e6)}@example.test`;

describe('sign-in throttle (ASVS V2.2.1, OWASP Authentication Cheat Sheet, RFC 6585)', () => {
	const inbox = async (to: string) => {
		const { config } = await import('$lib/server/config');
		const res = await fetch(
			`http://127.0.0.1:${config.mail.inboxPort}/api/messages?to=${encodeURIComponent(to)}`
		);
		return ((await res.json()) as { subject: string }[]).filter((m) =>
			/trying to sign in/.test(m.subject)
		);
	};

	it('one address: the 11th wrong password for the account is 429; another address still gets in', async () => {
		const { actions } = await import('../../src/routes/(auth)/signin/+page.server');
		const email = unique('pair');
		await createAccount({ name: 'Pair Count', email, password: 'the right password' });
		const tryFrom = (password: string, address: string) => {
			const e = event('http://localhost/signin', { email, password }, address);
			return run(actions.default, e.ev).then((r) => ({ r, e }));
		};
		const wrong = await Promise.all(
			Array.from({ length: 10 }, () => tryFrom('a wrong guess', '198.51.100.20'))
		);
		for (const { r } of wrong) expect(isActionFailure(r) && r.status).toBe(400);
		const { r: eleventh, e } = await tryFrom('a wrong guess', '198.51.100.20');
		expect(isActionFailure(eleventh) && eleventh.status).toBe(429);
		expect(e.locals.retryAfterS).toBeGreaterThan(0);
		expect((eleventh as { data: { message: string } }).data.message).toMatch(/Too many tries/);
		// The guesser's address is held back; the account is not: the owner elsewhere signs in.
		expect(isActionFailure((await tryFrom('the right password', '198.51.100.20')).r)).toBe(true);
		const owner = await tryFrom('the right password', '203.0.113.5');
		expect(isRedirect(owner.r)).toBe(true);
		expect(owner.e.jar.set.chipstall_session).toBeDefined();
	}, 60_000);

	it('a stranger spraying from 60 addresses cannot lock out a device that signed in before; the owner is told', async () => {
		const { actions } = await import('../../src/routes/(auth)/signin/+page.server');
		const email = unique('owner');
		await createAccount({ name: 'Owner Here', email, password: 'the right password' });
		const tryFrom = (password: string, address: string, cookies: Record<string, string> = {}) => {
			const e = event('http://localhost/signin', { email, password }, address, cookies);
			return run(actions.default, e.ev).then((r) => ({ r, e }));
		};
		// The owner's phone signed in yesterday and keeps its device cookie.
		const first = await tryFrom('the right password', '192.0.2.200');
		expect(isRedirect(first.r)).toBe(true);
		const device = first.e.jar.set.chipstall_device;
		expect(device.opts.httpOnly).toBe(true);

		// 60 wrong passwords, one each from 60 addresses (no per-address limit is reached).
		const spray = await Promise.all(
			Array.from({ length: 60 }, (_, i) => tryFrom('a wrong guess', `10.9.${i >> 8}.${i & 255}`))
		);
		const refused = spray.filter(({ r }) => isActionFailure(r) && r.status === 429);
		expect(refused.length).toBeGreaterThanOrEqual(10); // past 50 the account says "wait"
		// A new device with the right password waits too (the stranger could be anyone)...
		const fresh = await tryFrom('the right password', '192.0.2.201');
		expect(isActionFailure(fresh.r) && fresh.r.status).toBe(429);
		// ...but the owner's phone, from a new address even, is let in.
		const phone = await tryFrom('the right password', '192.0.2.202', {
			chipstall_device: device.value
		});
		expect(isRedirect(phone.r)).toBe(true);
		// A device cookie made for another account does not help here.
		const other = await tryFrom('the right password', '192.0.2.203', {
			chipstall_device: device.value.replace(/.$/, (c) => (c === 'A' ? 'B' : 'A'))
		});
		expect(isActionFailure(other.r) && other.r.status).toBe(429);
		// The account's owner hears of it once, not once per guess.
		await expect.poll(async () => (await inbox(email)).length, { timeout: 10_000 }).toBe(1);
	}, 90_000);

	it('counts per client address too', async () => {
		const { actions } = await import('../../src/routes/(auth)/signin/+page.server');
		const { throttles } = await import('$lib/server/http/throttles');
		const address = '203.0.113.99';
		// 300 attempts from one address (counted straight on its limiter: 300 password checks
		// would outlast the test's short window), then a sign-in to a fresh account from it.
		const taken = await Promise.all(
			Array.from({ length: 300 }, () => throttles.signInAddress.take(address))
		);
		expect(taken.every((v) => v.ok)).toBe(true);
		const e = event(
			'http://localhost/signin',
			{ email: unique('spray'), password: 'guess' },
			address
		);
		const r = await run(actions.default, e.ev);
		expect(isActionFailure(r) && r.status).toBe(429);
	});
});

describe('session cookie is Secure on an https request (ASVS V3.4.1)', () => {
	it('https request: Secure; plain http on localhost: not', async () => {
		const { actions } = await import('../../src/routes/(auth)/signin/+page.server');
		const email = unique('secure');
		await createAccount({ name: 'Sec Ure', email, password: 'the right password' });
		const https = event('https://shop.example/signin', { email, password: 'the right password' });
		expect(isRedirect(await run(actions.default, https.ev))).toBe(true);
		expect(https.jar.set.chipstall_session.opts.secure).toBe(true);
		expect(https.jar.set.chipstall_session.opts.httpOnly).toBe(true);
		const http = event('http://localhost/signin', { email, password: 'the right password' });
		expect(isRedirect(await run(actions.default, http.ev))).toBe(true);
		expect(http.jar.set.chipstall_session.opts.secure).toBe(false);
	});
});

describe('reset and sign-up do not tell who has an account (ASVS V2.5.2)', () => {
	const known = 'juniper@example.test'; // the seeded customer

	it('reset answers the same words for known and unknown, before any look-up or mail', async () => {
		const { actions } = await import('../../src/routes/(auth)/reset/+page.server');
		const { db } = await import('$lib/server/db');
		const { passwordResets, users } = await import('$lib/server/db/schema');
		const { eq, count } = await import('drizzle-orm');
		const [juniper] = await db.select({ id: users.id }).from(users).where(eq(users.email, known));
		const tokens = async () =>
			(
				await db
					.select({ n: count() })
					.from(passwordResets)
					.where(eq(passwordResets.userId, juniper.id))
			)[0].n;
		const ask = (email: string, ip: string) =>
			run(actions.default, event('http://localhost/reset', { email }, ip).ev);

		const before = await tokens();
		const a = (await ask(known, '192.0.2.1')) as { sent: boolean; email: string };
		// The answer is back, and the account has not even been looked up yet: no token row.
		// (Timing is then the same for everyone: nothing the answer waits on depends on the address.)
		expect(await tokens()).toBe(before);
		const b = (await ask('nobody-here@example.test', '192.0.2.2')) as typeof a;
		expect({ ...a, email: '' }).toEqual({ ...b, email: '' });
		// The work does happen, after the answer.
		await expect.poll(tokens, { timeout: 5000 }).toBe(before + 1);
	});

	it('a sixth reset for one address in the window is 429', async () => {
		const { actions } = await import('../../src/routes/(auth)/reset/+page.server');
		const email = unique('resetspam');
		const results = [];
		for (let i = 0; i < 6; i++)
			results.push(
				await run(
					actions.default,
					event('http://localhost/reset', { email }, `192.0.2.${20 + i}`).ev
				)
			);
		expect(results.slice(0, 5).every((r) => !isActionFailure(r))).toBe(true);
		expect(isActionFailure(results[5]) && results[5].status).toBe(429);
	});

	it('sign-up of a known address answers like a new one and mails the owner instead', async () => {
		const { actions } = await import('../../src/routes/(auth)/signup/+page.server');
		const form = (email: string) => ({
			name: 'Someone',
			email,
			password: 'a long password here',
			confirm: 'a long password here'
		});
		const fresh = unique('fresh');
		const a = await run(
			actions.default,
			event('http://localhost/signup', form(known), '192.0.2.40').ev
		);
		const b = await run(
			actions.default,
			event('http://localhost/signup', form(fresh), '192.0.2.41').ev
		);
		expect(a).toEqual({ sent: true, email: known });
		expect(b).toEqual({ sent: true, email: fresh });
	});
});
