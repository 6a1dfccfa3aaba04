import { and, asc, eq } from 'drizzle-orm';
import { db, type Db, type Tx } from '../db';
import { fairHelpers, users } from '../db/schema';
import { transact } from '../db/retry';
import { getFair } from './fairs';
import { DomainError } from '../errors/domain-error';

type Who = { id: string; role: string };

/**
 * The rule for a fair's booth, its sync API, booth orders and tally: the owner always; a helper
 * only when the owner named them for that fair; anyone else is refused with 403.
 */
export async function assertFairAccess(user: Who, fairId: number, conn: Db | Tx = db) {
	if (user.role === 'owner') return;
	if (user.role === 'helper') {
		const [row] = await conn
			.select({ userId: fairHelpers.userId })
			.from(fairHelpers)
			.where(and(eq(fairHelpers.fairId, fairId), eq(fairHelpers.userId, user.id)));
		if (row) return;
	}
	throw new DomainError(
		403,
		'You are not named as a helper at this fair. Ask the owner to add you on the fair’s page.'
	);
}

/** The fairs a helper was named for (the owner sees every fair). */
export async function helperFairIds(userId: string): Promise<Set<number>> {
	const rows = await db
		.select({ fairId: fairHelpers.fairId })
		.from(fairHelpers)
		.where(eq(fairHelpers.userId, userId));
	return new Set(rows.map((r) => r.fairId));
}

/** Every helper account, with whether it sells at this fair. */
export async function fairHelperChoices(fairId: number) {
	const [all, named] = await Promise.all([
		db
			.select({ id: users.id, name: users.name, email: users.email })
			.from(users)
			.where(eq(users.role, 'helper'))
			.orderBy(asc(users.name)),
		db
			.select({ userId: fairHelpers.userId })
			.from(fairHelpers)
			.where(eq(fairHelpers.fairId, fairId))
	]);
	const chosen = new Set(named.map((n) => n.userId));
	return all.map((u) => ({ ...u, sells: chosen.has(u.id) }));
}

/** Names exactly these helpers for the fair (the owner's choice replaces the old list). */
export async function setFairHelpers(fairId: number, userIds: string[]) {
	const fair = await getFair(fairId);
	if (fair.closedAt)
		throw new DomainError(409, 'This fair is closed; who sold there stays as it was.');
	const wanted = [...new Set(userIds)];
	await transact(async (tx) => {
		const helpers = await tx
			.select({ id: users.id })
			.from(users)
			.where(eq(users.role, 'helper'))
			.for('update');
		const known = new Set(helpers.map((h) => h.id));
		const unknown = wanted.filter((id) => !known.has(id));
		if (unknown.length) throw new DomainError(400, 'Only helper accounts can sell at a fair.');
		await tx.delete(fairHelpers).where(eq(fairHelpers.fairId, fairId));
		if (wanted.length)
			await tx
				.insert(fairHelpers)
				.values(wanted.map((userId) => ({ fairId, userId, addedAt: new Date() })));
	});
}
