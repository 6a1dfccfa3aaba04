/**
 * Refunds, owner only. The money moves at the payment server; this module keeps the order's
 * figures in step with it:
 *   1. one transaction locks the order, checks what is left to refund (counting refunds still
 *      being asked for, so two at once cannot pass what was paid) and writes a `pending` row;
 *   2. the payment server is asked through the SDK (idempotency key = that row), and a refusal
 *      deletes the row, so nothing is half-written;
 *   3. one transaction records the provider's refund, the order's refunded total, the move to
 *      `refunded` when nothing is left, and the pieces back on the shelf when the owner says
 *      they came back;
 *      and the buyer's e-mail goes into the outbox in that same transaction.
 * `charge.refunded` and `refund.updated` events keep the figures right when the provider tells
 * us something first (or something done outside the app).
 */
import { and, eq, sql } from 'drizzle-orm';
import { z } from 'zod';
import { formatMoney } from '$lib/locale/money';
import type { RefundInput } from '$lib/orders/refund-schema';
import { db, type Tx } from '../db';
import { transact } from '../db/retry';
import { orderLines, orderNotes, orderRefunds, orders } from '../db/schema';
import { queueMail, sendQueued } from '../mail/outbox';
import { stripe, type Stripe } from './stripe';
import { putBackStock } from '../stock/holds';
import { mailOrder } from './mail-order';
import { refundMail } from './shipping-mail';
import { replanQueue } from '../queue/carving-queue';
import { moveOrder } from './status';
import { DomainError } from '../errors/domain-error';

/** Statuses in which money has been taken and may be given back. */
const REFUNDABLE = [
	'paid',
	'deposit_held',
	'carving',
	'finishing',
	'packed',
	'shipped',
	'piece_gone'
] as const;

async function refundedSoFar(tx: Tx, orderId: number) {
	const [row] = await tx
		.select({
			done: sql<number>`coalesce(sum(case when ${orderRefunds.status} = 'succeeded' then ${orderRefunds.amountMinor} end), 0)`.mapWith(
				Number
			),
			asked:
				sql<number>`coalesce(sum(case when ${orderRefunds.status} = 'pending' then ${orderRefunds.amountMinor} end), 0)`.mapWith(
					Number
				)
		})
		.from(orderRefunds)
		.where(eq(orderRefunds.orderId, orderId));
	return row ?? { done: 0, asked: 0 };
}

/** Step 1: check and reserve. */
async function reserve(ref: string, input: RefundInput, userId: string, now: Date) {
	return transact(async (tx) => {
		const [o] = await tx.select().from(orders).where(eq(orders.ref, ref)).for('update');
		if (!o) throw new DomainError(404, `There is no order ${ref}.`);
		if (!(REFUNDABLE as readonly string[]).includes(o.status) || !o.paymentIntentId) {
			throw new DomainError(409, `Order ${ref} has not been paid, so there is nothing to refund.`);
		}
		const { done, asked } = await refundedSoFar(tx, o.id);
		const refunded = Math.max(done, o.refundedMinor);
		const left = o.totalMinor - refunded - asked;
		const money = (m: number) => formatMoney(m, o.currency);
		if (left <= 0) throw new DomainError(409, `Order ${ref} has already been refunded in full.`);
		const amount = input.amountMinor ?? left;
		if (amount > left) {
			throw new DomainError(
				400,
				`You can refund at most ${money(left)} on order ${ref}: ${money(o.totalMinor)} was paid and ${money(refunded + asked)} is already refunded.`
			);
		}
		const [{ id }] = await tx
			.insert(orderRefunds)
			.values({
				orderId: o.id,
				amountMinor: amount,
				reason: input.reason,
				status: 'pending',
				createdBy: userId,
				createdAt: now
			})
			.$returningId();
		return { rowId: id, orderId: o.id, paymentIntentId: o.paymentIntentId, amount };
	});
}

/** Sets the order's refunded total from its settled refunds (never below what the provider said). */
async function settleTotals(tx: Tx, orderId: number, providerTotal = 0) {
	const { done } = await refundedSoFar(tx, orderId);
	await tx
		.update(orders)
		.set({ refundedMinor: sql`greatest(${orders.refundedMinor}, ${done}, ${providerTotal})` })
		.where(eq(orders.id, orderId));
	// A locking read: a plain one would answer from this transaction's snapshot, which misses
	// what a refund event committed meanwhile when our update changed nothing.
	const [o] = await tx
		.select({ total: orders.totalMinor, refunded: orders.refundedMinor, status: orders.status })
		.from(orders)
		.where(eq(orders.id, orderId))
		.for('update');
	return o;
}

/** Moves a paid order refunded in full to `refunded`; true when it moved. */
async function moveIfFull(
	tx: Tx,
	orderId: number,
	by: { userId: string | null; why: string }
): Promise<boolean> {
	const [o] = await tx
		.select({ total: orders.totalMinor, refunded: orders.refundedMinor, status: orders.status })
		.from(orders)
		.where(eq(orders.id, orderId))
		.for('update');
	// Only an order that was paid moves; a replaced checkout refunded in full stays cancelled.
	if (
		o &&
		o.refunded >= o.total &&
		o.status !== 'refunded' &&
		(REFUNDABLE as readonly string[]).includes(o.status)
	) {
		await moveOrder(orderId, 'refunded', by, tx);
		return true;
	}
	return false;
}

/** Owner refunds part or all of a paid order. Returns what was refunded and the new totals. */
export async function refundOrder(
	ref: string,
	input: RefundInput,
	by: { userId: string },
	origin?: string,
	now = new Date()
) {
	const r = await reserve(ref, input, by.userId, now);
	let refund: Stripe.Refund;
	try {
		refund = await stripe().refunds.create(
			{
				payment_intent: r.paymentIntentId,
				amount: r.amount,
				reason: 'requested_by_customer',
				metadata: { orderRef: ref, refundRowId: String(r.rowId) }
			},
			// Keyed by order and reservation, so a retried request never refunds twice.
			{ idempotencyKey: `refund-${ref}-${r.rowId}` }
		);
	} catch (err) {
		await db.delete(orderRefunds).where(eq(orderRefunds.id, r.rowId));
		const e = err as { type?: string; message?: string };
		if (e.type === 'StripeInvalidRequestError' || e.type === 'StripeCardError') {
			throw new DomainError(409, `The payment server refused the refund: ${e.message}`);
		}
		throw new DomainError(503, 'The payment server could not be reached; nothing was refunded.');
	}

	const totals = await transact(async (tx) => {
		// The order row first, as the refund events do: one lock order, no deadlock between them.
		await tx.select({ id: orders.id }).from(orders).where(eq(orders.id, r.orderId)).for('update');
		const status = refund.status === 'succeeded' ? 'succeeded' : 'pending';
		await tx
			.update(orderRefunds)
			.set({ providerRefundId: refund.id, status })
			.where(eq(orderRefunds.id, r.rowId));
		const o = await settleTotals(tx, r.orderId);
		const moved = await moveIfFull(tx, r.orderId, {
			userId: by.userId,
			why: `Refunded in full: ${input.reason}`
		});
		if (input.restock) await restockOnce(tx, r.orderId, r.rowId);
		const order = await mailOrder(r.orderId, tx);
		const mail = await queueMail(tx, {
			to: order.email,
			...refundMail(
				order,
				{ amountMinor: r.amount, reason: input.reason, refundedTotalMinor: o.refunded },
				origin
			)
		});
		return { ...o, mail, moved };
	});
	await sendQueued([totals.mail]);
	// Refunded in full, the order leaves the carving queue.
	if (totals.moved) await replanQueue();
	return {
		refundId: refund.id,
		amountMinor: r.amount,
		refundedMinor: totals.refunded,
		totalMinor: totals.total
	};
}

/** The ready-made pieces of the order back on the workshop shelf, once per order. */
async function restockOnce(tx: Tx, orderId: number, refundRowId: number) {
	const [already] = await tx
		.select({ id: orderRefunds.id })
		.from(orderRefunds)
		.where(and(eq(orderRefunds.orderId, orderId), eq(orderRefunds.restocked, true)));
	if (already) return;
	const lines = await tx
		.select()
		.from(orderLines)
		.where(and(eq(orderLines.orderId, orderId), eq(orderLines.fromStock, true)));
	const [order] = await tx.select({ ref: orders.ref }).from(orders).where(eq(orders.id, orderId));
	await putBackStock(
		tx,
		lines.map((l) => ({ pieceId: l.pieceId, woodId: l.woodId, quantity: l.quantity })),
		`Came back from ${order?.ref ?? `order ${orderId}`} after a refund`
	);
	await tx.update(orderRefunds).set({ restocked: true }).where(eq(orderRefunds.id, refundRowId));
}

/** The owner says the piece came back after an earlier refund. */
export async function markPiecesReturned(ref: string) {
	return transact(async (tx) => {
		const [o] = await tx
			.select({ id: orders.id })
			.from(orders)
			.where(eq(orders.ref, ref))
			.for('update');
		if (!o) throw new DomainError(404, `There is no order ${ref}.`);
		const [last] = await tx
			.select({ id: orderRefunds.id })
			.from(orderRefunds)
			.where(and(eq(orderRefunds.orderId, o.id), eq(orderRefunds.status, 'succeeded')))
			.orderBy(sql`${orderRefunds.id} desc`)
			.limit(1);
		if (!last)
			throw new DomainError(
				409,
				'Refund the order first; then the piece can go back on the shelf.'
			);
		await restockOnce(tx, o.id, last.id);
	});
}

const refundStatus = (s: string | null | undefined) =>
	s === 'succeeded' || s === 'failed' || s === 'canceled' ? s : 'pending';

const intentId = z
	.union([z.string(), z.object({ id: z.string() })])
	.nullish()
	.transform((p) => (typeof p === 'string' ? p : (p?.id ?? null)));
const meta = z.record(z.string(), z.string()).nullish();

/** The fields of a `charge.refunded` event's object that we act on. */
export const refundedChargeObject = z.object({
	payment_intent: intentId,
	amount_refunded: z.number().int().min(0),
	metadata: meta
});
/** The fields of a `refund.updated` event's object that we act on. */
export const refundObject = z.object({
	id: z.string().min(1),
	amount: z.number().int().min(1),
	payment_intent: intentId,
	status: z.string().nullish(),
	reason: z.string().nullish(),
	created: z.number().int(),
	metadata: meta
});
export type RefundEventObject =
	| { type: 'charge.refunded'; object: z.infer<typeof refundedChargeObject> }
	| { type: 'refund.updated'; object: z.infer<typeof refundObject> };

async function lockOrder(tx: Tx, where: ReturnType<typeof eq>) {
	const [o] = await tx
		.select({
			id: orders.id,
			ref: orders.ref,
			status: orders.status,
			totalMinor: orders.totalMinor,
			currency: orders.currency,
			paymentIntentId: orders.paymentIntentId
		})
		.from(orders)
		.where(where)
		.for('update');
	return o ?? null;
}

const providerSaid = { userId: null, why: 'The payment server reported a full refund' };

/**
 * A refund event that does not fit what the shop knows: nothing changes, and the owner finds a
 * note on the order (and the log has it), so the provider is answered 200 and stops resending.
 */
async function mismatch(tx: Tx, orderId: number | null, why: string) {
	console.warn(`Refund event not applied: ${why}`);
	if (orderId !== null) {
		await tx.insert(orderNotes).values({
			orderId,
			userId: null,
			body: `A refund event from the payment server was not applied: ${why}`.slice(0, 2000),
			createdAt: new Date()
		});
	}
	return false;
}

/**
 * Applies a verified, field-checked `charge.refunded` or `refund.updated` inside the caller's
 * transaction (which records the event id too). Both are safe to apply twice: totals only grow
 * to what the provider says, and a refund row is keyed by the provider's id. An order whose
 * piece was gone stays for the owner to close.
 *
 * Nothing is taken on trust: the payment the event names must be the order's own payment (an
 * order named in the metadata with another order's payment is refused), and no refund may take
 * the refunded total past what was paid. A mismatch changes nothing but a note for the owner.
 */
export async function handleRefundEvent(e: RefundEventObject, tx: Tx): Promise<boolean> {
	const pi = e.object.payment_intent;
	const ref = e.object.metadata?.orderRef || undefined;
	const byRef = ref ? await lockOrder(tx, eq(orders.ref, ref)) : null;
	const byIntent = pi ? await lockOrder(tx, eq(orders.paymentIntentId, pi)) : null;
	const o = byRef ?? byIntent;
	if (!o) return false;
	if (!pi || o.paymentIntentId !== pi) {
		if (byIntent && byIntent.id !== o.id)
			await mismatch(tx, byIntent.id, `it named order ${o.ref}, which this payment is not for.`);
		return mismatch(
			tx,
			o.id,
			`its payment ${pi ?? '(none)'} is not the payment of order ${o.ref} (${o.paymentIntentId ?? 'unpaid'}).`
		);
	}
	const money = (m: number) => formatMoney(m, o.currency);
	if (e.type === 'refund.updated') {
		const refund = e.object;
		const status = refundStatus(refund.status);
		const rowId = Number(refund.metadata?.refundRowId);
		const [mine] = await tx
			.select({ id: orderRefunds.id, amountMinor: orderRefunds.amountMinor })
			.from(orderRefunds)
			.where(
				and(
					eq(orderRefunds.orderId, o.id),
					Number.isInteger(rowId) && rowId > 0
						? eq(orderRefunds.id, rowId)
						: eq(orderRefunds.providerRefundId, refund.id)
				)
			)
			.for('update');
		if (mine && mine.amountMinor !== refund.amount) {
			return mismatch(
				tx,
				o.id,
				`refund ${refund.id} says ${money(refund.amount)}, but ${money(mine.amountMinor)} was asked for.`
			);
		}
		if (!mine) {
			const others = await refundedSoFar(tx, o.id);
			if (status === 'succeeded' && others.done + refund.amount > o.totalMinor) {
				return mismatch(
					tx,
					o.id,
					`refund ${refund.id} of ${money(refund.amount)} would take the refunds past the ${money(o.totalMinor)} paid (${money(others.done)} already refunded).`
				);
			}
		}
		if (mine) {
			await tx
				.update(orderRefunds)
				.set({ providerRefundId: refund.id, status })
				.where(eq(orderRefunds.id, mine.id));
		} else {
			// Made outside the app (the provider's dashboard, the automatic refunds): record it.
			await tx
				.insert(orderRefunds)
				.values({
					orderId: o.id,
					providerRefundId: refund.id,
					amountMinor: refund.amount,
					reason: refund.metadata?.reason ?? refund.reason ?? 'Refunded at the payment server',
					status,
					createdAt: new Date(refund.created * 1000)
				})
				.onDuplicateKeyUpdate({ set: { status } });
		}
		await settleTotals(tx, o.id);
	} else {
		if (e.object.amount_refunded > o.totalMinor) {
			return mismatch(
				tx,
				o.id,
				`the charge says ${money(e.object.amount_refunded)} refunded, more than the ${money(o.totalMinor)} paid.`
			);
		}
		await settleTotals(tx, o.id, e.object.amount_refunded);
	}
	if (o.status !== 'piece_gone') await moveIfFull(tx, o.id, providerSaid);
	return true;
}

/** The refunds of an order, newest first, for its page. */
export async function refundsOf(orderId: number) {
	return db
		.select({
			id: orderRefunds.id,
			amountMinor: orderRefunds.amountMinor,
			reason: orderRefunds.reason,
			status: orderRefunds.status,
			restocked: orderRefunds.restocked,
			createdAt: orderRefunds.createdAt
		})
		.from(orderRefunds)
		.where(eq(orderRefunds.orderId, orderId))
		.orderBy(sql`${orderRefunds.id} desc`);
}
