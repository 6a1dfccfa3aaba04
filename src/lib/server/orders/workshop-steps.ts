/**
 * The workshop order page's steps, each checked here and answered with the sentence the page
 * shows once it is done; a refusal is a DomainError (the route answers it through `orFail`).
 */
import { eq } from 'drizzle-orm';
import { db } from '../db';
import { orders } from '../db/schema';
import { DomainError } from '../errors/domain-error';
import { statusLabel, type OrderStatus } from '$lib/orders/status';
import { formatMoney } from '$lib/locale/money';
import { isBenchMove } from '$lib/queue/workbench-moves';
import type { RefundInput } from '$lib/orders/refund-schema';
import { moveOrder } from './status';
import { shipOrder } from './ship';
import { markPiecesReturned, refundOrder } from './refunds';
import { cancelOrder, stepBackOrder } from './steer';
import { recordBalancePaid } from './balance';
import { addOrderNote, orderIdOf } from './workbench';

type By = { userId: string };

/** The order's currency, for reading a refund typed in it; 404 when there is no such order. */
export async function orderCurrency(ref: string): Promise<string> {
	const [o] = await db
		.select({ currency: orders.currency })
		.from(orders)
		.where(eq(orders.ref, ref));
	if (!o) throw new DomainError(404, 'There is no such order.');
	return o.currency;
}

/** A move on the bench (carving, finishing, packed); shipping and refunds have their own way. */
export async function benchMove(
	ref: string,
	m: { to: OrderStatus; why?: string; expect?: OrderStatus },
	by: By
): Promise<string> {
	if (!isBenchMove(m.to)) {
		throw new DomainError(
			400,
			'That change has its own way: the shipping or refund form, or the payment itself.'
		);
	}
	const id = await orderIdOf(ref);
	await moveOrder(id, m.to, {
		userId: by.userId,
		why: m.why || `Moved to ${statusLabel(m.to)}`,
		expect: m.expect
	});
	return `Moved to ${statusLabel(m.to)}.`;
}

export async function shipStep(
	ref: string,
	input: Parameters<typeof shipOrder>[1],
	by: By,
	origin: string
): Promise<string> {
	const s = await shipOrder(ref, input, by, origin);
	return s.mailed
		? `Shipped. The buyer has an e-mail with tracking number ${s.trackingNumber}.`
		: 'Shipped, but the e-mail to the buyer could not be sent.';
}

export async function refundStep(
	ref: string,
	input: RefundInput,
	by: By,
	origin: string
): Promise<string> {
	const currency = await orderCurrency(ref);
	const r = await refundOrder(ref, input, by, origin);
	const money = (m: number) => formatMoney(m, currency);
	return `Refunded ${money(r.amountMinor)}; ${money(r.refundedMinor)} of ${money(r.totalMinor)} refunded in all. The buyer has an e-mail.`;
}

export async function balanceStep(
	ref: string,
	method: Parameters<typeof recordBalancePaid>[1],
	by: By
): Promise<string> {
	await recordBalancePaid(ref, method, by);
	return 'Balance recorded as paid. The order can ship.';
}

/** Owner only, with a reason: a paid order is refunded in full through the refund code. */
export async function cancelStep(
	ref: string,
	input: Parameters<typeof cancelOrder>[1],
	by: By,
	origin: string
): Promise<string> {
	const r = await cancelOrder(ref, input, by, origin);
	return r.refundedMinor === null
		? 'Cancelled. The pieces it held are back on the shelf.'
		: 'Cancelled and refunded in full. The buyer has an e-mail.';
}

export async function backStep(
	ref: string,
	input: Parameters<typeof stepBackOrder>[1],
	by: By
): Promise<string> {
	const m = await stepBackOrder(ref, input, by);
	return `Back to ${statusLabel(m.to)}.`;
}

/** The owner says the piece came back after an earlier refund. */
export async function returnedStep(ref: string): Promise<string> {
	await markPiecesReturned(ref);
	return 'The ready-made pieces are back on the workshop shelf.';
}

export async function noteStep(ref: string, body: string, by: By): Promise<string> {
	await addOrderNote(ref, body, by.userId);
	return 'Note added.';
}
