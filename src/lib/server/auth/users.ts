import { eq } from 'drizzle-orm';
import { db, type Db, type Tx } from '../db';
import { isDuplicateKey } from '../db/retry';
import { users, type Role } from '../db/schema';
import { burnVerifyTime, hashPassword, verifyPassword } from './password';

export type AccountUser = { id: string; email: string; name: string; role: Role };

const publicColumns = { id: users.id, email: users.email, name: users.name, role: users.role };

export async function findUserByEmail(email: string): Promise<AccountUser | null> {
	const [row] = await db.select(publicColumns).from(users).where(eq(users.email, email)).limit(1);
	return row ?? null;
}

export async function findUserById(id: string): Promise<AccountUser | null> {
	const [row] = await db.select(publicColumns).from(users).where(eq(users.id, id)).limit(1);
	return row ?? null;
}

/** The account for this e-mail and password, or null without saying which part was wrong. */
export async function authenticate(email: string, password: string): Promise<AccountUser | null> {
	const [row] = await db
		.select({ ...publicColumns, passwordHash: users.passwordHash })
		.from(users)
		.where(eq(users.email, email))
		.limit(1);
	if (!row) {
		await burnVerifyTime(password);
		return null;
	}
	if (!(await verifyPassword(row.passwordHash, password))) return null;
	return { id: row.id, email: row.email, name: row.name, role: row.role };
}

export type NewAccount = { name: string; email: string; password: string; role?: Role };

/**
 * Creates an account. A taken e-mail is reported, not thrown — also when two sign-ups race
 * past the look-up and the unique index is what stops the second.
 */
export async function createAccount(
	input: NewAccount
): Promise<{ ok: true; user: AccountUser } | { ok: false; reason: 'email-taken' }> {
	if (await findUserByEmail(input.email)) return { ok: false, reason: 'email-taken' };
	const { password, ...rest } = input;
	return createAccountWithHash({ ...rest, passwordHash: await hashPassword(password) });
}

/**
 * As createAccount, with the password already hashed (a sign-up confirmed by e-mail, which
 * passes when the address was proven and its own transaction).
 */
export async function createAccountWithHash(
	input: Omit<NewAccount, 'password'> & { passwordHash: string; emailConfirmedAt?: Date },
	conn: Db | Tx = db
): Promise<{ ok: true; user: AccountUser } | { ok: false; reason: 'email-taken' }> {
	const user: AccountUser = {
		id: crypto.randomUUID(),
		email: input.email,
		name: input.name,
		role: input.role ?? 'customer'
	};
	try {
		await conn.insert(users).values({
			...user,
			passwordHash: input.passwordHash,
			emailConfirmedAt: input.emailConfirmedAt ?? null,
			createdAt: new Date()
		});
	} catch (err) {
		if (isDuplicateKey(err)) return { ok: false, reason: 'email-taken' };
		throw err;
	}
	return { ok: true, user };
}
