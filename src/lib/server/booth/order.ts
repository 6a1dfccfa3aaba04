import { createHash } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { db } from '../db';
import {
	boothSales,
	fairs,
	pieces,
	pieceWoods,
	shippingRates,
	woods,
	type Role
} from '../db/schema';
import { isDuplicateKey, transact } from '../db/retry';
import { placeBoothOrder as placeOrderFromBooth } from '../orders/booth';
import { boothOrderSigners, queueBoothOrderLetters } from '../orders/booth-mail';
import { replanQueue } from '../queue/carving-queue';
import { sendQueued } from '../mail/outbox';
import type { BoothOrder } from '$lib/booth/sync-message';
import { lateVerdict, saleTimeProblem } from '$lib/booth/rules';
import { fairStateShared } from '../fairs/fairs';
import { DomainError } from '../errors/domain-error';

/** What the phone said, in a fixed order, hashed: the same id with other content is a conflict. */
const orderHash = (o: BoothOrder) =>
	createHash('sha256')
		.update(
			JSON.stringify([
				o.id,
				new Date(o.at).toISOString(),
				o.pieceSlug,
				o.woodSlug,
				o.initials,
				o.name,
				o.email,
				o.line1,
				o.city,
				o.region ?? '',
				o.postcode,
				o.country,
				o.depositMinor,
				o.method,
				o.delivery
			])
		)
		.digest('hex');

/**
 * A personalised piece ordered at the booth: the orders module writes the order (deposit taken,
 * balance due — or paid in full), and beside it a booth entry of kind 'deposit' under the phone's
 * id, so the deposit counts in the tally's cash or card and a resend stores nothing new. Like a
 * sale, an order made before the close is taken after it (late). In the same transaction the
 * queue dates the order and the buyer's letter and the workshop's alert are queued; they are sent
 * after the commit.
 */
export async function placeBoothOrder(
	fairId: number,
	given: Omit<BoothOrder, 'delivery'> & { delivery?: BoothOrder['delivery'] },
	seller: { id: string; role: Role },
	origin?: string
) {
	const o: BoothOrder = { ...given, delivery: given.delivery ?? 'post' };
	const [row] = await db
		.select({ piece: pieces, wood: woods })
		.from(pieces)
		.innerJoin(pieceWoods, eq(pieceWoods.pieceId, pieces.id))
		.innerJoin(woods, eq(woods.id, pieceWoods.woodId))
		.where(and(eq(pieces.slug, o.pieceSlug), eq(woods.slug, o.woodSlug)));
	const hash = orderHash(o);
	const [seen] = await db
		.select({ hash: boothSales.contentHash, fairId: boothSales.fairId })
		.from(boothSales)
		.where(eq(boothSales.id, o.id));
	if (seen) return resent(seen, hash, fairId);
	if (!row) throw new DomainError(400, `${o.pieceSlug} is not made in ${o.woodSlug}.`);
	const [fairDays] = await db.select().from(fairs).where(eq(fairs.id, fairId));
	if (!fairDays) throw new DomainError(404, 'There is no such fair.');
	const at = new Date(o.at);
	const when = saleTimeProblem(at, fairDays);
	if (when) throw new DomainError(400, when.replace('The sale', 'The order'));
	const rates = o.delivery === 'post' ? await db.select().from(shippingRates) : [];
	const who = await boothOrderSigners(seller.id);

	let placed: {
		id: number;
		ref: string;
		totalMinor: number;
		late: boolean;
		mails: number[];
	};
	try {
		placed = await transact(async (tx) => {
			const fair = await fairStateShared(tx, fairId);
			const verdict = lateVerdict(at, fair.closedAt);
			if (verdict === 'after close')
				throw new DomainError(400, `${fair.name} was closed before this order was taken.`);
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
				soldAt: at,
				receivedAt: now,
				recordedBy: seller.id,
				contentHash: hash,
				late: verdict === 'late'
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
				delivery: o.delivery,
				rates,
				takenBy: seller.id,
				now
			});
			await tx.update(boothSales).set({ orderId: order.id }).where(eq(boothSales.id, o.id));
			const mails = await queueBoothOrderLetters(tx, order.id, fair.name, who, now, origin);
			return { ...order, late: verdict === 'late', mails };
		});
	} catch (err) {
		if (isDuplicateKey(err)) {
			const [again] = await db
				.select({ hash: boothSales.contentHash, fairId: boothSales.fairId })
				.from(boothSales)
				.where(eq(boothSales.id, o.id));
			if (again) return resent(again, hash, fairId);
		}
		throw err;
	}
	await sendQueued(placed.mails);
	await replanQueue();
	return {
		status: 'accepted' as const,
		ref: placed.ref,
		totalMinor: placed.totalMinor,
		late: placed.late
	};
}

function resent(seen: { hash: string | null; fairId: number }, hash: string, fairId: number) {
	if (seen.fairId !== fairId || (seen.hash && seen.hash !== hash))
		throw new DomainError(
			409,
			'A different order was already stored under this id; this copy was not stored. Check it and take it again if it was a real order.'
		);
	return { status: 'duplicate' as const };
}
