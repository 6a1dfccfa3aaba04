import { and, eq, inArray } from 'drizzle-orm';
import { z } from 'zod';
import { db, type Db, type Tx } from '../db';
import { transact } from '../db/retry';
import { settings, users } from '../db/schema';
import { queueMail } from '../mail/outbox';
import { mailOrder } from './mail-order';
import { newOrderAlertMail } from './shipping-mail';

const KEY = 'orderAlertHelpers';
const helperIds = z.array(z.string().max(36)).max(200);

/** Helpers who asked for an e-mail on each paid order (the owner always gets one). */
export async function alertHelperIds(conn: Db | Tx = db): Promise<string[]> {
	const [row] = await conn.select().from(settings).where(eq(settings.key, KEY)).limit(1);
	const parsed = row ? helperIds.safeParse(row.value) : null;
	return parsed?.success ? parsed.data : [];
}

export async function setAlertOptIn(userId: string, on: boolean) {
	await transact(async (tx) => {
		const [row] = await tx.select().from(settings).where(eq(settings.key, KEY)).for('update');
		const parsed = row ? helperIds.safeParse(row.value) : null;
		const now = new Set(parsed?.success ? parsed.data : []);
		if (on) now.add(userId);
		else now.delete(userId);
		const value = [...now];
		await tx.insert(settings).values({ key: KEY, value }).onDuplicateKeyUpdate({ set: { value } });
	});
}

async function alertRecipients(conn: Db | Tx): Promise<string[]> {
	const helpers = await alertHelperIds(conn);
	const owners = await conn
		.select({ email: users.email })
		.from(users)
		.where(eq(users.role, 'owner'));
	const asked = helpers.length
		? await conn
				.select({ email: users.email })
				.from(users)
				.where(and(eq(users.role, 'helper'), inArray(users.id, helpers)))
		: [];
	return [...new Set([...owners, ...asked].map((u) => u.email))];
}

/**
 * The workshop's alert for a paid order, written to the outbox inside the transaction that
 * records the payment (so it exists exactly when the payment does). Returns the outbox ids.
 */
export async function queueNewOrderAlert(tx: Tx, orderId: number, origin: string) {
	const order = await mailOrder(orderId, tx);
	const to = await alertRecipients(tx);
	if (to.length === 0) return [];
	return [await queueMail(tx, { to, ...newOrderAlertMail(order, origin, order.promisedBy) })];
}
