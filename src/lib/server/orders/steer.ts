/**
 * The owner steering an order by hand: cancel it, or take it one step back. Both need a reason,
 * which lands in the order's history through `moveOrder` (the one function that moves orders).
 * Cancelling a paid order is a full refund through the refund code, so the money, the e-mail to
 * the buyer and the move to "Refunded" happen exactly as they do from the refund form.
 */
import { eq } from 'drizzle-orm';
import { canCancel, stepBackTo, statusLabel, type OrderStatus } from '$lib/orders/status';
import { db } from '../db';
import { transact } from '../db/retry';
import { orders } from '../db/schema';
import { releaseInTx } from './holds';
import { refundOrder } from './refunds';
import { moveOrder, needsCarving } from './status';
import { DomainError } from '../errors/domain-error';

async function current(ref: string) {
	const [o] = await db
		.select({ id: orders.id, status: orders.status, paymentIntentId: orders.paymentIntentId })
		.from(orders)
		.where(eq(orders.ref, ref));
	if (!o) throw new DomainError(404, `There is no order ${ref}.`);
	return o;
}

/**
 * Cancels an order. An unpaid checkout is cancelled and its held pieces go back on the shelf;
 * a paid, unshipped order is refunded in full (its ready-made pieces back on the shelf, since
 * they never left). `expect` is the status the owner saw: a second click finds it changed.
 */
export async function cancelOrder(
	ref: string,
	input: { reason: string; expect: OrderStatus },
	by: { userId: string },
	origin?: string
): Promise<{ refundedMinor: number | null }> {
	const o = await current(ref);
	if (o.status !== input.expect) {
		throw new DomainError(
			409,
			`Order ${ref} is already “${statusLabel(o.status)}”; nothing was changed.`
		);
	}
	if (!canCancel(o.status)) {
		throw new DomainError(
			409,
			o.status === 'shipped'
				? `Order ${ref} has shipped: refund it instead of cancelling.`
				: `Order ${ref} is “${statusLabel(o.status)}” and cannot be cancelled.`
		);
	}
	if (o.status === 'pending') {
		const done = await transact((tx) =>
			releaseInTx(tx, o.id, `Cancelled: ${input.reason}`, by.userId)
		);
		if (!done) throw new DomainError(409, `Order ${ref} is no longer waiting for payment.`);
		return { refundedMinor: null };
	}
	if (!o.paymentIntentId) {
		throw new DomainError(
			409,
			`Order ${ref} was not paid online, so the app cannot refund it. Give the money back in person and note it here.`
		);
	}
	const r = await refundOrder(
		ref,
		{
			amountMinor: null,
			reason: `Order cancelled: ${input.reason}`,
			restock: o.status !== 'piece_gone'
		},
		by,
		origin
	);
	return { refundedMinor: r.amountMinor };
}

/** Takes the order one step back (carving → paid, finishing → carving, packed → finishing). */
export async function stepBackOrder(
	ref: string,
	input: { reason: string; expect: OrderStatus },
	by: { userId: string }
): Promise<{ from: OrderStatus; to: OrderStatus }> {
	const o = await current(ref);
	const to = stepBackTo(input.expect, {
		needsCarving: await transact((tx) => needsCarving(tx, o.id))
	});
	if (!to) {
		throw new DomainError(
			409,
			`Order ${ref} cannot go back a step from “${statusLabel(o.status)}”.`
		);
	}
	const moved = await moveOrder(o.id, to, {
		userId: by.userId,
		why: `Back a step: ${input.reason}`,
		back: true,
		expect: input.expect
	});
	return moved;
}
