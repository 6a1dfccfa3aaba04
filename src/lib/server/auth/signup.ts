import { eq, lt } from 'drizzle-orm';
import { config } from '../config';
import { db } from '../db';
import { pendingSignups } from '../db/schema';
import { sendMail } from '../mail';
import { hashPassword } from './password';
import { generateToken, hashToken } from './token';
import { createAccountWithHash, findUserByEmail } from './users';

export const SIGNUP_LIFETIME_MS = 24 * 60 * 60 * 1000;

export type SignUpRequest = { name: string; email: string; password: string };

/**
 * The second half of a sign-up, run after the form has answered. A new address gets a link that
 * makes the account; an address that already has one gets a note telling its owner, so the form
 * never says which addresses have accounts (OWASP ASVS 4.0 V2.5.2 / Authentication Cheat Sheet).
 */
export async function requestSignUp(input: SignUpRequest, now = new Date()): Promise<void> {
	const existing = await findUserByEmail(input.email);
	if (existing) {
		await sendMail({
			to: existing.email,
			subject: 'Someone tried to make a Chipstall account with your address',
			text: [
				`Hello ${existing.name},`,
				'',
				'Someone (perhaps you) tried to make a new Chipstall account with this e-mail address.',
				'You already have one, so nothing was changed.',
				'',
				`To sign in: ${config.origin}/signin`,
				`Forgot your password? ${config.origin}/reset`,
				'',
				'If it was not you, you can ignore this e-mail.'
			].join('\n')
		});
		return;
	}
	const token = generateToken();
	await db.delete(pendingSignups).where(lt(pendingSignups.expiresAt, now));
	await db.insert(pendingSignups).values({
		id: hashToken(token),
		email: input.email,
		name: input.name,
		passwordHash: await hashPassword(input.password),
		expiresAt: new Date(now.getTime() + SIGNUP_LIFETIME_MS)
	});
	const link = `${config.origin}/signup/${token}`;
	await sendMail({
		to: input.email,
		subject: 'Finish making your Chipstall account',
		text: [
			`Hello ${input.name},`,
			'',
			'Open this link within a day to finish making your Chipstall account:',
			'',
			link,
			'',
			'If you did not ask for an account, ignore this e-mail: nothing is made without the link.'
		].join('\n')
	});
}

export type SignUpState = 'valid' | 'unknown' | 'expired';

async function pendingRow(token: string) {
	const [row] = await db
		.select()
		.from(pendingSignups)
		.where(eq(pendingSignups.id, hashToken(token)))
		.limit(1);
	return row;
}

export async function checkSignUpToken(token: string, now = new Date()): Promise<SignUpState> {
	const row = await pendingRow(token);
	if (!row) return 'unknown';
	return row.expiresAt.getTime() <= now.getTime() ? 'expired' : 'valid';
}

/**
 * Makes the account from a pending sign-up and spends the link. When the address got an account
 * meanwhile (two links, or the owner added them), the link is spent and reports 'taken'.
 */
export async function completeSignUp(
	token: string,
	now = new Date()
): Promise<{ ok: true; userId: string } | { ok: false; state: 'unknown' | 'expired' | 'taken' }> {
	const row = await pendingRow(token);
	if (!row) return { ok: false, state: 'unknown' };
	// Deleting first makes the link single-use even when two clicks race.
	const [res] = await db.delete(pendingSignups).where(eq(pendingSignups.id, row.id));
	if (res.affectedRows !== 1) return { ok: false, state: 'unknown' };
	if (row.expiresAt.getTime() <= now.getTime()) return { ok: false, state: 'expired' };
	const created = await createAccountWithHash({
		name: row.name,
		email: row.email,
		passwordHash: row.passwordHash,
		role: 'customer'
	});
	return created.ok ? { ok: true, userId: created.user.id } : { ok: false, state: 'taken' };
}
