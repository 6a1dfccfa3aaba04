import { and, eq, inArray } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../db';
import { settings, users } from '../db/schema';
import { sendMail } from '../mail';
import { promiseReadyBy } from './carving-queue';
import { mailOrder } from './mail-order';
import { newOrderAlertMail } from './shipping-mail';

const KEY = 'orderAlertHelpers';
const helperIds = z.array(z.string().max(36)).max(200);

/** Helpers who asked for an e-mail on each paid order (the owner always gets one). */
export async function alertHelperIds(): Promise<string[]> {
	const [row] = await db.select().from(settings).where(eq(settings.key, KEY)).limit(1);
	const parsed = row ? helperIds.safeParse(row.value) : null;
	return parsed?.success ? parsed.data : [];
}

export async function setAlertOptIn(userId: string, on: boolean) {
	await db.transaction(async (tx) => {
		const [row] = await tx.select().from(settings).where(eq(settings.key, KEY)).for('update');
		const parsed = row ? helperIds.safeParse(row.value) : null;
		const now = new Set(parsed?.success ? parsed.data : []);
		if (on) now.add(userId);
		else now.delete(userId);
		const value = [...now];
		await tx.insert(settings).values({ key: KEY, value }).onDuplicateKeyUpdate({ set: { value } });
	});
}

async function alertRecipients(): Promise<string[]> {
	const helpers = await alertHelperIds();
	const owners = await db.select({ email: users.email }).from(users).where(eq(users.role, 'owner'));
	const asked = helpers.length
		? await db
				.select({ email: users.email })
				.from(users)
				.where(and(eq(users.role, 'helper'), inArray(users.id, helpers)))
		: [];
	return [...new Set([...owners, ...asked].map((u) => u.email))];
}

/**
 * After a payment is recorded: the queue changed, so every queued order's ready-by date is worked
 * out again and this order's is kept as the buyer's promise; then the workshop hears of the
 * order. Run before the buyer's paid e-mail, which states that promise. Neither may undo or fail
 * the payment.
 */
export async function afterOrderPaid(orderId: number, origin: string) {
	try {
		await promiseReadyBy(orderId);
	} catch (err) {
		console.error('ready-by recompute failed', orderId, err);
	}
	try {
		const [order, to] = await Promise.all([mailOrder(orderId), alertRecipients()]);
		if (to.length) await sendMail({ to, ...newOrderAlertMail(order, origin, order.promisedBy) });
	} catch (err) {
		console.error('new-order alert failed', orderId, err);
	}
}
