/**
 * Orders a buyer placed as a guest gather into their account, but only once the account's
 * address is proven: someone opened a link we e-mailed to it. Otherwise anyone could sign up
 * with another person's address and read their orders.
 */
import { and, eq, isNull, sql } from 'drizzle-orm';
import { db, type Db, type Tx } from '../db';
import { orders, users } from '../db/schema';

/** The form of an address two orders or an order and an account are compared in. */
export const sameAddress = (email: string) => email.trim().toLowerCase();

/**
 * Attaches every order without an account placed with this address (compared trimmed and
 * case-blind) to the account. Idempotent: an order already attached is never moved, so a link
 * used twice or two tabs at once attach each order once. Returns how many it attached.
 */
export async function attachGuestOrders(tx: Tx, userId: string, email: string): Promise<number> {
	const [res] = await tx
		.update(orders)
		.set({ userId })
		.where(and(isNull(orders.userId), sql`lower(trim(${orders.email})) = ${sameAddress(email)}`));
	return res.affectedRows;
}

/**
 * Records that the account's owner opened a link e-mailed to its address, and gathers the guest
 * orders of that address, in the caller's transaction. The user row is locked first, so two
 * confirmations at once take turns. Returns how many orders were attached.
 */
export async function confirmEmail(tx: Tx, userId: string, now = new Date()): Promise<number> {
	const [user] = await tx
		.select({ email: users.email, confirmedAt: users.emailConfirmedAt })
		.from(users)
		.where(eq(users.id, userId))
		.for('update');
	if (!user) return 0;
	if (!user.confirmedAt) {
		await tx.update(users).set({ emailConfirmedAt: now }).where(eq(users.id, userId));
	}
	return attachGuestOrders(tx, userId, user.email);
}

/** The account whose address is proven for this e-mail, if any: later guest orders join it. */
export async function confirmedAccountFor(tx: Db | Tx, email: string): Promise<string | null> {
	const [row] = await tx
		.select({ id: users.id })
		.from(users)
		.where(and(eq(users.email, sameAddress(email)), sql`${users.emailConfirmedAt} is not null`))
		.limit(1);
	return row?.id ?? null;
}

/** Whether the account's address has been proven by a link we e-mailed to it. */
export async function isEmailConfirmed(userId: string): Promise<boolean> {
	const [row] = await db
		.select({ at: users.emailConfirmedAt })
		.from(users)
		.where(eq(users.id, userId));
	return Boolean(row?.at);
}
