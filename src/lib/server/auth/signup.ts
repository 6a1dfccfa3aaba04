import { eq, lt } from 'drizzle-orm';
import { config } from '../config';
import { db } from '../db';
import { transact } from '../db/retry';
import { pendingSignups } from '../db/schema';
import { sendMail } from '../mail/send';
import { hashPassword } from './password';
import { generateToken, hashToken } from './token';
import { createAccountWithHash, findUserByEmail } from './users';
import { attachGuestOrders } from './guest-orders';

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
		subject: 'Welcome to Chipstall: confirm your address to open your account',
		text: [
			`Hello ${input.name},`,
			'',
			'Welcome to Chipstall. Your account keeps every order in one place, with its progress',
			'from the carving bench to your door, and fills in your name and e-mail at checkout.',
			'',
			'Open this link within a day to confirm this e-mail address and open your account.',
			'Orders you have already placed with this address as a guest will appear in it too.',
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

export type SignUpDone =
	| { ok: true; userId: string; attached: number }
	| { ok: false; state: 'unknown' | 'expired' | 'taken' };

/**
 * Makes the account from a pending sign-up and spends the link, in one transaction. Opening the
 * link proves the address, so the account starts confirmed and the orders placed with that
 * address as a guest join it. When the address got an account meanwhile (two links, or the owner
 * added them), the link is spent and reports 'taken', and nothing is attached.
 */
export async function completeSignUp(token: string, now = new Date()): Promise<SignUpDone> {
	return transact(async (tx): Promise<SignUpDone> => {
		// Locked and deleted first: the link is single-use even when two clicks race.
		const [row] = await tx
			.select()
			.from(pendingSignups)
			.where(eq(pendingSignups.id, hashToken(token)))
			.for('update');
		if (!row) return { ok: false, state: 'unknown' };
		await tx.delete(pendingSignups).where(eq(pendingSignups.id, row.id));
		if (row.expiresAt.getTime() <= now.getTime()) return { ok: false, state: 'expired' };
		const created = await createAccountWithHash(
			{
				name: row.name,
				email: row.email,
				passwordHash: row.passwordHash,
				role: 'customer',
				emailConfirmedAt: now
			},
			tx
		);
		if (!created.ok) return { ok: false, state: 'taken' };
		const attached = await attachGuestOrders(tx, created.user.id, row.email);
		return { ok: true, userId: created.user.id, attached };
	});
}
