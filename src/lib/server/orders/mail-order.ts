import { eq } from 'drizzle-orm';
import { db, type Db, type Tx } from '../db';
import { orderLines, orders, pieces } from '../db/schema';
import type { MailOrder } from './shipping-mail';
import { buyerReadyBy } from '$lib/queue/carving-queue';
import { orderBalance } from '$lib/orders/balance';

/** Just what the workshop's e-mails say about an order. */
export async function mailOrder(
	orderId: number,
	conn: Db | Tx = db
): Promise<MailOrder & { email: string; readyBy: string | null; promisedBy: string | null }> {
	const [o] = await conn.select().from(orders).where(eq(orders.id, orderId));
	if (!o) throw new Error(`order ${orderId} not found`);
	const lines = await conn
		.select({
			quantity: orderLines.quantity,
			title: orderLines.title,
			woodName: orderLines.woodName,
			personalisation: orderLines.personalisation,
			// The piece's kind and food flag choose the care words (see $lib/catalogue/care).
			kind: pieces.kind,
			foodContact: pieces.foodContact
		})
		.from(orderLines)
		.innerJoin(pieces, eq(pieces.id, orderLines.pieceId))
		.where(eq(orderLines.orderId, orderId))
		.orderBy(orderLines.id);
	return {
		ref: o.ref,
		buyerName: o.buyerName,
		email: o.email,
		currency: o.currency,
		totalMinor: o.totalMinor,
		readyBy: o.readyBy,
		promisedBy: buyerReadyBy(o),
		// A booth order: what was taken as a deposit and what is still owed.
		...(o.depositMinor !== null
			? { depositMinor: o.depositMinor, balanceMinor: orderBalance(o).balanceMinor }
			: {}),
		lines: lines.map((l) => ({
			quantity: l.quantity,
			title: l.title,
			woodName: l.woodName,
			initials: l.personalisation?.initials || null,
			kind: l.kind,
			foodContact: l.foodContact
		}))
	};
}
