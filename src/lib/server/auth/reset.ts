import { and, eq, isNull } from 'drizzle-orm';
import { db } from '../db';
import { transact } from '../db/retry';
import { confirmEmail } from './guest-orders';
import { passwordResets, sessions, users } from '../db/schema';
import { hashPassword } from './password';
import { generateToken, hashToken } from './token';
import { findUserByEmail, type AccountUser } from './users';

export const RESET_LIFETIME_MS = 60 * 60 * 1000;

export type ResetState = 'valid' | 'unknown' | 'used' | 'expired';

/**
 * Makes a single-use reset token for the account with this e-mail, or null when there is no
 * such account. Only the token's SHA-256 is stored; the token itself goes into the link.
 */
export async function createResetToken(
	email: string,
	now = new Date()
): Promise<{ token: string; user: AccountUser; expiresAt: Date } | null> {
	const user = await findUserByEmail(email);
	if (!user) return null;
	const token = generateToken();
	const expiresAt = new Date(now.getTime() + RESET_LIFETIME_MS);
	await db.insert(passwordResets).values({ id: hashToken(token), userId: user.id, expiresAt });
	return { token, user, expiresAt };
}

type ResetRow = { usedAt: Date | null; expiresAt: Date } | undefined;

function stateOf(row: ResetRow, now: Date): ResetState {
	if (!row) return 'unknown';
	if (row.usedAt) return 'used';
	if (row.expiresAt.getTime() <= now.getTime()) return 'expired';
	return 'valid';
}

/** Whether a link's token can still be used, for showing the form or a clear message. */
export async function checkResetToken(token: string, now = new Date()): Promise<ResetState> {
	const [row] = await db
		.select({ usedAt: passwordResets.usedAt, expiresAt: passwordResets.expiresAt })
		.from(passwordResets)
		.where(eq(passwordResets.id, hashToken(token)))
		.limit(1);
	return stateOf(row, now);
}

/**
 * Sets the new password and spends the token, in one transaction with the token row locked so
 * two submissions of the same link cannot both succeed. Every session of the account ends
 * (whoever knew the old password is signed out); the caller signs the user in afresh.
 */
export async function completeReset(
	token: string,
	newPassword: string,
	now = new Date()
): Promise<{ ok: true; userId: string } | { ok: false; state: Exclude<ResetState, 'valid'> }> {
	const passwordHash = await hashPassword(newPassword);
	return transact(async (tx) => {
		const [row] = await tx
			.select({
				userId: passwordResets.userId,
				usedAt: passwordResets.usedAt,
				expiresAt: passwordResets.expiresAt
			})
			.from(passwordResets)
			.where(eq(passwordResets.id, hashToken(token)))
			.for('update');
		const state = stateOf(row, now);
		if (state !== 'valid') return { ok: false as const, state };
		await tx.update(users).set({ passwordHash }).where(eq(users.id, row.userId));
		// Spend this token and any other open one for the account.
		await tx
			.update(passwordResets)
			.set({ usedAt: now })
			.where(and(eq(passwordResets.userId, row.userId), isNull(passwordResets.usedAt)));
		await tx.delete(sessions).where(eq(sessions.userId, row.userId));
		// The link reached the account's address, which proves it: guest orders join it now.
		await confirmEmail(tx, row.userId, now);
		return { ok: true as const, userId: row.userId };
	});
}
