/**
 * An order's hold on finished pieces: a pending checkout keeps them off the shelf until it is
 * paid; leaving the payment page, its expiry or the sweep cancels the order and puts them back
 * (through `$lib/server/stock/holds`, the stock tables' one writer).
 */
import { and, eq, isNotNull, lt } from 'drizzle-orm';
import { db, type Tx } from '../db';
import { transact } from '../db/retry';
import { orderLines, orders } from '../db/schema';
import { putBackStock, type Want } from '../stock/holds';
import { moveOrder } from './status';
import { config } from '../config';
import { startOncePerInterval } from '../jobs/once-per-interval';

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
