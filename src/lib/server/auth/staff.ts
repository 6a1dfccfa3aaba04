import { and, asc, eq, inArray } from 'drizzle-orm';
import { db } from '../db';
import { transact } from '../db/retry';
import { sessions, users } from '../db/schema';
import { createAccount, findUserByEmail, type AccountUser } from './users';

/** Owner and helpers, owner first, then by name. */
export async function listStaff(): Promise<AccountUser[]> {
	const rows = await db
		.select({ id: users.id, email: users.email, name: users.name, role: users.role })
		.from(users)
		.where(inArray(users.role, ['owner', 'helper']))
		.orderBy(asc(users.role), asc(users.name));
	return rows;
}

export type StaffResult =
	{ ok: true; user: AccountUser } | { ok: false; field: 'email' | 'userId'; message: string };

/** A new helper account with a temporary password the owner hands over in person. */
export async function addHelper(input: {
	name: string;
	email: string;
	password: string;
}): Promise<StaffResult> {
	const existing = await findUserByEmail(input.email);
	if (existing) return { ok: false, field: 'email', message: alreadyThere(existing) };
	const created = await createAccount({ ...input, role: 'helper' });
	if (!created.ok) {
		return { ok: false, field: 'email', message: 'An account with this e-mail already exists.' };
	}
	return created;
}

function alreadyThere(user: AccountUser): string {
	if (user.role === 'customer') {
		return 'This e-mail already has a customer account. Use "Make an existing customer a helper" below.';
	}
	return `This e-mail already belongs to ${user.role === 'owner' ? 'the owner' : 'a helper'}.`;
}

/** Turns an existing customer account into a helper; their password stays theirs. */
export async function promoteCustomer(email: string): Promise<StaffResult> {
	const user = await findUserByEmail(email);
	if (!user) return { ok: false, field: 'email', message: 'No account uses this e-mail.' };
	if (user.role !== 'customer') return { ok: false, field: 'email', message: alreadyThere(user) };
	await db
		.update(users)
		.set({ role: 'helper' })
		.where(and(eq(users.id, user.id), eq(users.role, 'customer')));
	return { ok: true, user: { ...user, role: 'helper' } };
}

/**
 * A helper goes back to being a customer and every session of theirs ends, in one transaction,
 * so they cannot keep a workshop page open with a session from before. Only helpers can be
 * removed: the owner (including the one asking) stays.
 */
export async function removeHelper(actorId: string, userId: string): Promise<StaffResult> {
	if (actorId === userId) {
		return { ok: false, field: 'userId', message: 'You cannot remove yourself.' };
	}
	return transact(async (tx) => {
		const [user] = await tx
			.select({ id: users.id, email: users.email, name: users.name, role: users.role })
			.from(users)
			.where(eq(users.id, userId))
			.for('update');
		if (!user || user.role !== 'helper') {
			return {
				ok: false as const,
				field: 'userId' as const,
				message: 'That person is not a helper.'
			};
		}
		await tx.update(users).set({ role: 'customer' }).where(eq(users.id, userId));
		await tx.delete(sessions).where(eq(sessions.userId, userId));
		return { ok: true as const, user: { ...user, role: 'customer' as const } };
	});
}
