import { and, eq } from 'drizzle-orm';
import { db } from '../db';
import {
	boothSales,
	orderHistory,
	orderLines,
	orders,
	pieces,
	pieceWoods,
	woods,
	type Role
} from '../db/schema';
import { isDuplicateKey, withRetry } from '../db/retry';
import { personalise } from '../personalise';
import { personalisedPriceMinor } from '$lib/personalised-price';
import { priceSale } from '$lib/reconcile';
import type { BoothOrder } from '$lib/schemas/fairs';
import { FairError } from './errors';
import { fairStateShared } from './fairs';
import { uniqueRef } from '../orders/place';

/**
 * A personalised piece ordered at the booth: one `orders` row (status 'paid', the deposit in
 * `deposit_minor`, the rest to pay before it ships), one `order_lines` row with the server's own
 * personalisation snapshot, and a booth entry of kind 'deposit' under the phone's id so the
 * deposit counts in the tally's cash or card and a resend stores nothing new.
 */
export async function placeBoothOrder(
	fairId: number,
	o: BoothOrder,
	seller: { id: string; role: Role }
) {
	const [row] = await db
		.select({ piece: pieces, wood: woods })
		.from(pieces)
		.innerJoin(pieceWoods, eq(pieceWoods.pieceId, pieces.id))
		.innerJoin(woods, eq(woods.id, pieceWoods.woodId))
		.where(and(eq(pieces.slug, o.pieceSlug), eq(woods.slug, o.woodSlug)));
	if (!row) throw new FairError(`${o.pieceSlug} is not made in ${o.woodSlug}.`);
	if (!row.piece.personalisable) throw new FairError(`${row.piece.title} is not carved to order.`);
	const made = personalise(row.piece, row.wood, { initials: o.initials });
	if (!made.ok)
		throw new FairError(Object.values(made.fields)[0]?.[0] ?? 'Those initials do not fit.');
	const unit = personalisedPriceMinor(row.piece.basePriceMinor, row.wood.priceAddOnMinor);

	try {
		return await withRetry(() =>
			db.transaction(async (tx) => {
				const fair = await fairStateShared(tx, fairId);
				if (fair.closedAt)
					throw new FairError(`${fair.name} is closed; it takes no more orders.`, 409);
				const priced = priceSale(
					[{ unitMinor: unit, quantity: 1 }],
					0,
					fair.salesTaxBp,
					fair.pricesIncludeTax
				);
				if (o.depositMinor > priced.totalMinor) {
					throw new FairError('The deposit is more than the order’s total.');
				}
				const now = new Date();
				// The booth entry goes in first: a resend waits on its key, then fails as a duplicate.
				await tx.insert(boothSales).values({
					id: o.id,
					fairId,
					kind: 'deposit',
					method: o.method,
					lines: [],
					subtotalMinor: o.depositMinor,
					totalMinor: o.depositMinor,
					soldAt: new Date(o.at),
					receivedAt: now,
					recordedBy: seller.id
				});
				const [{ id: orderId }] = await tx
					.insert(orders)
					.values({
						ref: await uniqueRef(tx),
						email: o.email,
						buyerName: o.name,
						address: {
							line1: o.line1,
							city: o.city,
							region: o.region,
							postcode: o.postcode,
							country: o.country
						},
						giftNote: `Ordered at ${fair.name}`.slice(0, 500),
						currency: fair.currency,
						subtotalMinor: priced.taxableMinor,
						shippingMinor: 0,
						taxMinor: priced.taxMinor,
						totalMinor: priced.totalMinor,
						depositMinor: o.depositMinor,
						status: 'paid',
						createdAt: now,
						paidAt: now
					})
					.$returningId();
				await tx.insert(orderLines).values({
					orderId,
					pieceId: row.piece.id,
					woodId: row.wood.id,
					title: row.piece.title,
					woodName: row.wood.name,
					quantity: 1,
					// Net of tax, so the order's lines add up to its subtotal as online orders do.
					unitPriceMinor: priced.taxableMinor,
					lineTotalMinor: priced.taxableMinor,
					personalisation: made.snapshot
				});
				// Born paid (the deposit is in hand); its history says where and by whom.
				await tx.insert(orderHistory).values({
					orderId,
					fromStatus: 'pending',
					toStatus: 'paid',
					userId: seller.id,
					reason: `Ordered at ${fair.name}; deposit taken`.slice(0, 500),
					createdAt: now
				});
				await tx.update(boothSales).set({ orderId }).where(eq(boothSales.id, o.id));
				const [{ ref }] = await tx
					.select({ ref: orders.ref })
					.from(orders)
					.where(eq(orders.id, orderId));
				return { status: 'accepted' as const, ref, totalMinor: priced.totalMinor };
			})
		);
	} catch (err) {
		if (isDuplicateKey(err)) {
			const [seen] = await db
				.select({ id: boothSales.id })
				.from(boothSales)
				.where(eq(boothSales.id, o.id));
			if (seen) return { status: 'duplicate' as const };
		}
		throw err;
	}
}
