import { eq } from 'drizzle-orm';
import { statusLabel, type OrderStatus } from '$lib/orders/status';
import { db } from '../db';
import { transact } from '../db/retry';
import { orders } from '../db/schema';
import { replanQueue } from '../queue/carving-queue';
import { moveOrder } from './status';
import { DomainError } from '../errors/domain-error';

/**
 * Moves several orders to one status, each in its own transaction through the status table, so
 * one order that may not move does not hold back the rest; the carving queue is planned once,
 * after them all. Says what happened to each.
 */
export async function moveOrders(refs: string[], to: OrderStatus, userId: string) {
	const out: { ref: string; ok: boolean; message: string }[] = [];
	for (const ref of [...new Set(refs)]) {
		const [o] = await db.select({ id: orders.id }).from(orders).where(eq(orders.ref, ref));
		if (!o) {
			out.push({ ref, ok: false, message: 'No such order.' });
			continue;
		}
		try {
			await transact((tx) =>
				moveOrder(o.id, to, { userId, why: `Moved with others to ${statusLabel(to)}` }, tx)
			);
			out.push({ ref, ok: true, message: `Now ${statusLabel(to)}.` });
		} catch (err) {
			if (!(err instanceof DomainError)) throw err;
			out.push({ ref, ok: false, message: err.message });
		}
	}
	if (out.some((r) => r.ok)) await replanQueue();
	return out;
}
