import { eq } from 'drizzle-orm';
import { transact } from '../db/retry';
import { orders, shipments } from '../db/schema';
import { queueMail, sendQueued } from '../mail/outbox';
import type { ShipmentInput } from '$lib/orders/shipment-schema';
import { moveOrder } from './status';
import { mailOrder } from './mail-order';
import { shippingMail } from './shipping-mail';
import { DomainError } from '../errors/domain-error';

/**
 * The parcel has gone: in one transaction move the order to `shipped` through the status table
 * (which refuses an unpaid, unpacked or already shipped order with a 409), write the shipment and
 * queue the buyer's e-mail in the outbox; after the commit it is sent (or left for the drainer).
 */
export async function shipOrder(
	ref: string,
	input: ShipmentInput,
	by: { userId: string },
	origin?: string,
	now = new Date()
) {
	const shipment = await transact(async (tx) => {
		const [order] = await tx
			.select({ id: orders.id })
			.from(orders)
			.where(eq(orders.ref, ref))
			.for('update');
		if (!order) throw new DomainError(404, `There is no order ${ref}.`);
		await moveOrder(
			order.id,
			'shipped',
			{ userId: by.userId, why: `Shipped with ${input.carrier}, tracking ${input.trackingNumber}` },
			tx,
			{},
			now
		);
		const row = {
			orderId: order.id,
			carrier: input.carrier,
			trackingNumber: input.trackingNumber,
			shippedAt: new Date(Math.floor(now.getTime() / 1000) * 1000)
		};
		const [{ id }] = await tx.insert(shipments).values(row).$returningId();
		const mailTo = await mailOrder(order.id, tx);
		const mail = await queueMail(tx, { to: mailTo.email, ...shippingMail(mailTo, row, origin) });
		return { id, mail, ...row };
	});
	await sendQueued([shipment.mail]);
	// Queued with the shipment, so it goes out even if SMTP is down just now.
	const mailed = true;
	return {
		id: shipment.id,
		ref,
		carrier: shipment.carrier,
		trackingNumber: shipment.trackingNumber,
		shippedAt: shipment.shippedAt.toISOString(),
		mailed
	};
}
