import { and, eq } from 'drizzle-orm';
import { db } from '../db';
import { boothSales, pieces, pieceWoods, woods, type Role } from '../db/schema';
import { isDuplicateKey, withRetry } from '../db/retry';
import { placeBoothOrder as placeOrderFromBooth } from '../orders/booth';
import { afterBoothOrder } from '../orders/booth-mail';
import { OrderError } from '../orders/place';
import type { BoothOrder } from '$lib/schemas/fairs';
import { FairError } from './errors';
import { fairStateShared } from './fairs';

/**
 * A personalised piece ordered at the booth: the orders module writes the order (paid in part,
 * the rest owed before it ships), and beside it a booth entry of kind 'deposit' under the phone's
 * id, so the deposit counts in the tally's cash or card and a resend stores nothing new. After
 * the commit the queue dates the order and the buyer gets a confirmation.
 */
export async function placeBoothOrder(
	fairId: number,
	o: BoothOrder,
	seller: { id: string; role: Role },
	origin?: string
) {
	const [row] = await db
		.select({ piece: pieces, wood: woods })
		.from(pieces)
		.innerJoin(pieceWoods, eq(pieceWoods.pieceId, pieces.id))
		.innerJoin(woods, eq(woods.id, pieceWoods.woodId))
		.where(and(eq(pieces.slug, o.pieceSlug), eq(woods.slug, o.woodSlug)));
	if (!row) throw new FairError(`${o.pieceSlug} is not made in ${o.woodSlug}.`);

	let placed: { id: number; ref: string; totalMinor: number; fairName: string };
	try {
		placed = await withRetry(() =>
			db.transaction(async (tx) => {
				const fair = await fairStateShared(tx, fairId);
				if (fair.closedAt)
					throw new FairError(`${fair.name} is closed; it takes no more orders.`, 409);
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
				const order = await placeOrderFromBooth(tx, {
					piece: row.piece,
					wood: row.wood,
					initials: o.initials,
					buyer: {
						name: o.name,
						email: o.email,
						address: {
							line1: o.line1,
							city: o.city,
							...(o.region ? { region: o.region } : {}),
							postcode: o.postcode,
							country: o.country
						}
					},
					fair,
					depositMinor: o.depositMinor,
					takenBy: seller.id,
					now
				});
				await tx.update(boothSales).set({ orderId: order.id }).where(eq(boothSales.id, o.id));
				return { ...order, fairName: fair.name };
			})
		);
	} catch (err) {
		if (err instanceof OrderError) throw new FairError(err.message, 400);
		if (isDuplicateKey(err)) {
			const [seen] = await db
				.select({ id: boothSales.id })
				.from(boothSales)
				.where(eq(boothSales.id, o.id));
			if (seen) return { status: 'duplicate' as const };
		}
		throw err;
	}
	await afterBoothOrder(placed.id, placed.fairName, origin);
	return { status: 'accepted' as const, ref: placed.ref, totalMinor: placed.totalMinor };
}
