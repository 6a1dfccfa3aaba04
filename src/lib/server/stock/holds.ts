/**
 * Stock holds: a checkout takes finished pieces off the workshop shelf while the buyer pays;
 * cancelling, expiry or the sweep puts them back. Every change locks the stock rows it touches,
 * in id order so two transactions never wait on each other in a circle.
 */
import { and, eq, inArray, isNotNull, lt, sql } from 'drizzle-orm';
import { db, type Tx } from '../db';
import { transact } from '../db/retry';
import { orderLines, orders, stock, stockAdjustments, WORKSHOP } from '../db/schema';
import { moveOrder } from '../orders/status';
import { config } from '../config';
import { startOncePerInterval } from '../jobs/once-per-interval';

type Want = { pieceId: number; woodId: number; quantity: number };

/** Finished pieces on the workshop shelf for one piece in one wood. */
export async function stockOnHand(pieceId: number, woodId: number) {
	const [row] = await db
		.select({ quantity: stock.quantity })
		.from(stock)
		.where(and(eq(stock.pieceId, pieceId), eq(stock.woodId, woodId), eq(stock.place, WORKSHOP)));
	return row?.quantity ?? 0;
}

async function lockShelf(tx: Tx, wants: Want[]) {
	if (wants.length === 0) return [];
	return tx
		.select({
			id: stock.id,
			pieceId: stock.pieceId,
			woodId: stock.woodId,
			quantity: stock.quantity
		})
		.from(stock)
		.where(
			and(
				eq(stock.place, WORKSHOP),
				inArray(
					stock.pieceId,
					wants.map((w) => w.pieceId)
				)
			)
		)
		.orderBy(stock.id)
		.for('update');
}

/** Every change of stock leaves an adjustment row with its reason, as the owner's own do. */
async function logAdjustments(tx: Tx, wants: Want[], sign: 1 | -1, reason: string) {
	if (wants.length === 0) return;
	const createdAt = new Date();
	await tx.insert(stockAdjustments).values(
		wants.map((w) => ({
			pieceId: w.pieceId,
			woodId: w.woodId,
			place: WORKSHOP,
			delta: sign * w.quantity,
			reason: reason.slice(0, 160),
			userId: null,
			createdAt
		}))
	);
}

/**
 * Takes every wanted piece off the shelf, or none: returns the first line that is short (and
 * changes nothing) when the shelf cannot cover them all. Never takes stock below zero. `reason`
 * goes on the adjustment rows (which order took them).
 */
export async function takeStock(tx: Tx, wants: Want[], reason: string): Promise<Want | null> {
	const rows = await lockShelf(tx, wants);
	const need = new Map<number, number>();
	for (const w of wants) {
		const row = rows.find((r) => r.pieceId === w.pieceId && r.woodId === w.woodId);
		const total = (row ? (need.get(row.id) ?? 0) : 0) + w.quantity;
		if (!row || row.quantity < total) return w;
		need.set(row.id, total);
	}
	for (const [id, qty] of need) {
		await tx
			.update(stock)
			.set({ quantity: sql`${stock.quantity} - ${qty}` })
			.where(eq(stock.id, id));
	}
	await logAdjustments(tx, wants, -1, reason);
	return null;
}

/** Puts pieces back on the shelf (a shelf row is made if the owner deleted it meanwhile). */
export async function putBackStock(tx: Tx, wants: Want[], reason: string) {
	const rows = await lockShelf(tx, wants);
	for (const w of wants) {
		const row = rows.find((r) => r.pieceId === w.pieceId && r.woodId === w.woodId);
		if (row) {
			await tx
				.update(stock)
				.set({ quantity: sql`${stock.quantity} + ${w.quantity}` })
				.where(eq(stock.id, row.id));
		} else {
			await tx.insert(stock).values({ ...w, place: WORKSHOP });
		}
	}
	await logAdjustments(tx, wants, 1, reason);
}

/** The finished pieces an order holds (or needs to hold). */
export async function heldLines(tx: Tx, orderId: number): Promise<Want[]> {
	return tx
		.select({
			pieceId: orderLines.pieceId,
			woodId: orderLines.woodId,
			quantity: orderLines.quantity
		})
		.from(orderLines)
		.where(and(eq(orderLines.orderId, orderId), eq(orderLines.fromStock, true)));
}

/**
 * Cancels a still-pending order and puts its held pieces back, inside the caller's transaction.
 * False (and nothing changed) when the order is not pending.
 */
export async function releaseInTx(
	tx: Tx,
	orderId: number,
	why: string,
	userId: string | null = null
): Promise<boolean> {
	const [order] = await tx
		.select({ status: orders.status, ref: orders.ref })
		.from(orders)
		.where(eq(orders.id, orderId))
		.for('update');
	if (!order || order.status !== 'pending') return false;
	await putBackStock(tx, await heldLines(tx, orderId), `Hold of ${order.ref} released: ${why}`);
	await moveOrder(orderId, 'cancelled', { userId, why }, tx, { holdExpiresAt: null });
	return true;
}

/** Puts held pieces back and cancels a still-pending order; false if it was not pending. */
export async function releaseOrder(orderId: number, why = 'The buyer left the payment page.') {
	return transact((tx) => releaseInTx(tx, orderId, why));
}

const SWEEP_LOCK = 'chipstall_hold_sweep';

/**
 * Releases holds whose time is up (a safety net for expiry events that never come). Runs under a
 * database-wide named lock so two app processes on one database never sweep at once; a process
 * that finds the lock taken skips this round. Returns how many orders it released.
 */
export async function releaseExpiredHolds(now = new Date()): Promise<number> {
	const conn = await db.$client.getConnection();
	try {
		const [rows] = await conn.query('select get_lock(?, 0) as got', [SWEEP_LOCK]);
		if ((rows as { got: number | null }[])[0]?.got !== 1) return 0;
		try {
			const stale = await db
				.select({ id: orders.id })
				.from(orders)
				.where(
					and(
						eq(orders.status, 'pending'),
						isNotNull(orders.holdExpiresAt),
						lt(orders.holdExpiresAt, now)
					)
				);
			let released = 0;
			for (const o of stale) {
				if (await releaseOrder(o.id, 'The hold ran out before a payment arrived.')) released++;
			}
			return released;
		} finally {
			await conn.query('select release_lock(?)', [SWEEP_LOCK]);
		}
	} finally {
		conn.release();
	}
}

/**
 * Sweeps once a minute (HOLD_SWEEP_EVERY_MS) in total across all app processes, in case the
 * payment provider's expiry event never arrives; each sweep is recorded in job_runs.
 */
export function startHoldSweeper() {
	startOncePerInterval('hold-sweep', config.holdSweepEveryMs, () => releaseExpiredHolds());
}
