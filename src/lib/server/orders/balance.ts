/**
 * The rest of a deposit order, paid: the owner records when and how, the order's history says so,
 * and from then on it may ship. Locks the order row so two clicks record it once.
 */
import { eq } from 'drizzle-orm';
import { formatMoney } from '$lib/locale/money';
import { orderBalance, type BalanceMethod } from '$lib/orders/balance';
import { transact } from '../db/retry';
import { orderHistory, orders } from '../db/schema';
import { DomainError } from '../errors/domain-error';

const METHOD_WORDS: Record<BalanceMethod, string> = {
	cash: 'in cash',
	card: 'by card',
	transfer: 'by bank transfer',
	other: 'another way'
};

export async function recordBalancePaid(
	ref: string,
	method: BalanceMethod,
	by: { userId: string },
	now = new Date()
) {
	return transact(async (tx) => {
		const [order] = await tx.select().from(orders).where(eq(orders.ref, ref)).for('update');
		if (!order) throw new DomainError(404, `There is no order ${ref}.`);
		const owed = orderBalance(order).balanceMinor;
		if (owed === 0) throw new DomainError(409, `Order ${ref} has nothing left to pay.`);
		if (order.status === 'cancelled' || order.status === 'refunded')
			throw new DomainError(409, `Order ${ref} is ${order.status}; there is no balance to take.`);
		const at = new Date(Math.floor(now.getTime() / 1000) * 1000);
		await tx
			.update(orders)
			.set({ balancePaidAt: at, balanceMethod: method })
			.where(eq(orders.id, order.id));
		const words = `Balance of ${formatMoney(owed, order.currency)} paid ${METHOD_WORDS[method]}`;
		// Paid in full: an order still waiting on its balance joins the flow as paid.
		const toStatus = order.status === 'deposit_held' ? 'paid' : order.status;
		if (toStatus !== order.status)
			await tx.update(orders).set({ status: toStatus }).where(eq(orders.id, order.id));
		await tx.insert(orderHistory).values({
			orderId: order.id,
			fromStatus: order.status,
			toStatus,
			userId: by.userId,
			reason: words,
			createdAt: at
		});
		return { ref, paidMinor: owed, method };
	});
}
