/** What the workshop's order page shows beside the lines: history, notes and refunds. */
import { desc, eq } from 'drizzle-orm';
import { db } from '../db';
import { transact } from '../db/retry';
import { orderHistory, orderNotes, orders, users } from '../db/schema';
import { refundsOf } from './refunds';
import { DomainError } from '../errors/domain-error';

export async function orderWorkbench(orderId: number) {
	const [history, notes, refunds] = await Promise.all([
		db
			.select({
				id: orderHistory.id,
				from: orderHistory.fromStatus,
				to: orderHistory.toStatus,
				why: orderHistory.reason,
				at: orderHistory.createdAt,
				by: users.name
			})
			.from(orderHistory)
			.leftJoin(users, eq(users.id, orderHistory.userId))
			.where(eq(orderHistory.orderId, orderId))
			.orderBy(orderHistory.id),
		db
			.select({
				id: orderNotes.id,
				body: orderNotes.body,
				at: orderNotes.createdAt,
				by: users.name
			})
			.from(orderNotes)
			.leftJoin(users, eq(users.id, orderNotes.userId))
			.where(eq(orderNotes.orderId, orderId))
			.orderBy(desc(orderNotes.id)),
		refundsOf(orderId)
	]);
	return { history, notes, refunds };
}

export async function orderIdOf(ref: string): Promise<number> {
	const [o] = await db.select({ id: orders.id }).from(orders).where(eq(orders.ref, ref));
	if (!o) throw new DomainError(404, `There is no order ${ref}.`);
	return o.id;
}

export async function addOrderNote(ref: string, body: string, userId: string) {
	await transact(async (tx) => {
		const [o] = await tx.select({ id: orders.id }).from(orders).where(eq(orders.ref, ref));
		if (!o) throw new DomainError(404, `There is no order ${ref}.`);
		await tx.insert(orderNotes).values({ orderId: o.id, userId, body, createdAt: new Date() });
	});
}
