/**
 * Sign-in throttling a stranger cannot turn against the account's owner, after OWASP's
 * Authentication Cheat Sheet ("Account lockout": lockout lets an attacker deny the owner;
 * prefer throttling, and let a device that signed in before through — OWASP's device cookies):
 *
 * - every attempt counts per account and client address together (a guesser at one address is
 *   slowed down after a few tries without touching anyone else), and per address (the spray
 *   limit for many accounts from one address);
 * - every attempt without the account's device cookie also counts on the account as a whole:
 *   past that limit such attempts wait out the window, but a device holding a device cookie for
 *   the account (given on each successful sign-in, signed, bound to the address) still gets in;
 * - the first time in a window that the whole-account limit is passed, the account's owner is
 *   e-mailed that someone is guessing at it.
 */
import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { Cookies } from '@sveltejs/kit';
import { config } from '../config';
import { sendMail } from '../mail/send';
import { Limiter, takeAll, type Verdict } from '../http/rate-limit';
import { throttles } from '../http/throttles';
import { findUserByEmail } from './users';

export const DEVICE_COOKIE = 'chipstall_device';
const DEVICE_DAYS = 365;

const sign = (email: string, nonce: string) =>
	createHmac('sha256', config.linkSecret)
		.update(`device:${email.toLowerCase()}:${nonce}`)
		.digest('base64url');

/** A device cookie's value for this account: a random nonce and its signature. */
export function deviceToken(email: string): string {
	const nonce = randomBytes(16).toString('base64url');
	return `${nonce}.${sign(email, nonce)}`;
}

/** True when the cookie was given by this shop to a device that signed in to this account. */
export function isTrustedDevice(email: string, cookie: string | undefined): boolean {
	if (!cookie) return false;
	const [nonce, mac] = cookie.split('.');
	if (!nonce || !mac) return false;
	const want = Buffer.from(sign(email, nonce));
	const got = Buffer.from(mac);
	return want.length === got.length && timingSafeEqual(want, got);
}

/** Remembers this device for the account (after the right password). */
export function trustDevice(cookies: Cookies, email: string, https: boolean) {
	cookies.set(DEVICE_COOKIE, deviceToken(email), {
		path: '/',
		httpOnly: true,
		sameSite: 'lax',
		secure: https,
		maxAge: DEVICE_DAYS * 86_400
	});
}

/** One alert per account per window, counted in the shared store like the attempts. */
const alerted = () =>
	new Limiter({ prefix: 'signin-alert', points: 1, durationS: config.throttleWindowS });
let alertLimiter: Limiter | undefined;

async function tellOwner(email: string, origin: string) {
	alertLimiter ??= alerted();
	if (!(await alertLimiter.take(email)).ok) return;
	const user = await findUserByEmail(email);
	if (!user) return;
	const minutes = Math.round(config.throttleWindowS / 60);
	await sendMail({
		to: user.email,
		subject: 'Someone is trying to sign in to your Chipstall account',
		text: [
			`Hello ${user.name},`,
			'',
			`Many wrong passwords were tried for your account in the last ${minutes} minutes, from places that have not signed in to it before.`,
			'',
			'Your password was not guessed. Devices you have signed in with before still get in as usual; new ones are held back for a while.',
			'',
			`If this was not you, nothing needs doing now; if your password is short or used elsewhere, change it: ${origin}/reset`
		].join('\n')
	});
}

export type SignInGate = Verdict & { trusted: boolean };

/**
 * Counts one attempt before the password is checked. `ok: false` carries how long to wait.
 */
export async function signInGate(
	email: string,
	address: string,
	deviceCookie: string | undefined,
	origin: string
): Promise<SignInGate> {
	const account = email.toLowerCase();
	const trusted = isTrustedDevice(account, deviceCookie);
	const verdict = await takeAll([
		[throttles.signInAddress, address],
		[throttles.signInPair, `${account}\n${address}`],
		...(trusted ? [] : ([[throttles.signInAccount, account]] as [Limiter, string][]))
	]);
	if (!trusted && !verdict.ok) {
		// Only the whole-account limit says no to many addresses at once: that is a guessing run.
		const accountOnly = await throttles.signInAccount.isOver(account);
		if (accountOnly)
			void tellOwner(account, origin).catch((err) => console.error('sign-in alert failed', err));
	}
	return { ...verdict, trusted };
}

/** After the right password: this address's count for the account starts again. */
export async function signInSucceeded(email: string, address: string) {
	await throttles.signInPair.forget(`${email.toLowerCase()}\n${address}`);
}
