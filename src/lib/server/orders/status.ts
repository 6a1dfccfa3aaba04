import { and, eq, sql } from 'drizzle-orm';
import { db, type Db, type Tx } from '../db';
import { inTx } from '../db/retry';
import { QUEUED_STATUSES, replanQueue } from '../queue/carving-queue';
import { orderHistory, orderLines, orders } from '../db/schema';
import { canMove, statusLabel, stepBackTo, type OrderStatus } from '$lib/orders/status';
import { orderBalance } from '$lib/orders/balance';
import { formatMoney } from '$lib/locale/money';
import { DomainError } from '../errors/domain-error';

/**
 * Who moves the order and why. `back` asks for one step back (see `backSteps`), which needs a
 * reason; `expect` is the status the person saw, so a second click of the same button (or a
 * stale tab) is refused instead of moving the order a second time.
 */
export type MovedBy = { userId: string | null; why: string; back?: boolean; expect?: OrderStatus };

/** True when the order has a line made to order (not taken finished from the shelf). */
export async function needsCarving(tx: Tx, orderId: number): Promise<boolean> {
	const [row] = await tx
		.select({ n: sql<number>`count(*)`.mapWith(Number) })
		.from(orderLines)
		.where(and(eq(orderLines.orderId, orderId), eq(orderLines.fromStock, false)));
	return (row?.n ?? 0) > 0;
}

/**
 * The one way an order changes status: lock the order row, check the move against the table in
 * `$lib/orders/status`, update it, and write who/when/why to the order's history. Pass `tx` to
 * make the move part of a larger write (the payment event, a refund); without it the move is
 * its own transaction, retried on deadlock, and when the order joins or leaves the carving queue
 * the queue is planned again after the commit (with `tx`, that is the caller's to do after its
 * own commit). `extra` sets other order columns in the same update.
 */
export async function moveOrder(
	orderId: number,
	to: OrderStatus,
	by: MovedBy,
	tx?: Tx,
	extra: Partial<typeof orders.$inferInsert> = {},
	now = new Date()
): Promise<{ from: OrderStatus; to: OrderStatus }> {
	const moved = await inTx(tx, async (t) => {
		const [order] = await t
			.select({
				id: orders.id,
				ref: orders.ref,
				status: orders.status,
				currency: orders.currency,
				totalMinor: orders.totalMinor,
				depositMinor: orders.depositMinor,
				balancePaidAt: orders.balancePaidAt,
				paidAt: orders.paidAt
			})
			.from(orders)
			.where(eq(orders.id, orderId))
			.for('update');
		if (!order) throw new DomainError(409, 'There is no such order.');
		const from = order.status;
		if (by.expect && by.expect !== from) {
			throw new DomainError(
				409,
				`Order ${order.ref} is already “${statusLabel(from)}”; nothing was changed.`
			);
		}
		const carve = { needsCarving: await needsCarving(t, orderId) };
		if (by.back && !by.why.trim())
			throw new DomainError(409, 'Say why the order goes back a step.');
		const allowed = by.back ? stepBackTo(from, carve) === to : canMove(from, to, carve);
		if (!allowed) {
			throw new DomainError(
				409,
				`Order ${order.ref} is “${statusLabel(from)}” and cannot move to “${statusLabel(to)}”.`
			);
		}
		// A deposit order ships only once the rest is paid (the parcel is the last leverage).
		const owed = orderBalance(order).balanceMinor;
		if ((to === 'shipped' || (from === 'deposit_held' && to === 'paid')) && owed > 0) {
			throw new DomainError(
				409,
				`Order ${order.ref} still has ${formatMoney(owed, order.currency)} to pay. Record the balance as paid ${to === 'paid' ? 'first' : 'before it ships'}.`
			);
		}
		await t
			.update(orders)
			.set({ ...extra, status: to })
			.where(eq(orders.id, orderId));
		await t.insert(orderHistory).values({
			orderId,
			fromStatus: from,
			toStatus: to,
			userId: by.userId,
			reason: by.why.slice(0, 500),
			createdAt: now
		});
		return { from, to };
	});
	if (!tx && (isQueued(moved.from) || isQueued(moved.to))) await replanQueue();
	return moved;
}

const isQueued = (s: OrderStatus) => (QUEUED_STATUSES as readonly string[]).includes(s);

/** An order's history, oldest first. */
export async function orderHistoryOf(orderId: number, conn: Db | Tx = db) {
	return conn
		.select()
		.from(orderHistory)
		.where(eq(orderHistory.orderId, orderId))
		.orderBy(orderHistory.id);
}
