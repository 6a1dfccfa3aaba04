/**
 * What a packing or gift slip prints for one order: the buyer's address, the lines with wood and
 * personalisation, the gift note, the shop's return address. Read-only, one query per order.
 */
import { isoDay } from '$lib/locale/dates';
import { buyerReadyBy } from '$lib/queue/carving-queue';
import { readyByWords } from '$lib/orders/ready-by-words';
import { asc, inArray } from 'drizzle-orm';
import { db } from '../db';
import { orderLines, orders } from '../db/schema';
import { addressLines, getShopInfo } from '../settings/shop-settings';

export type SlipLine = {
	title: string;
	woodName: string;
	quantity: number;
	unitPriceMinor: number;
	lineTotalMinor: number;
	initials: string | null;
	style: string | null;
};

export type SlipOrder = {
	ref: string;
	buyerName: string;
	address: string[];
	giftNote: string | null;
	currency: string;
	subtotalMinor: number;
	shippingMinor: number;
	taxMinor: number;
	totalMinor: number;
	placedOn: string;
	/** The ready-by day the buyer was given, in words; null when not dated. */
	readyBy: string | null;
	lines: SlipLine[];
};

export type SlipShop = { name: string; email: string; address: string[] };

/** The orders in the order asked for; refs that match nothing come back in `missing`. */
export async function slipOrders(refs: string[]) {
	const rows = refs.length ? await db.select().from(orders).where(inArray(orders.ref, refs)) : [];
	const lines = rows.length
		? await db
				.select()
				.from(orderLines)
				.where(
					inArray(
						orderLines.orderId,
						rows.map((r) => r.id)
					)
				)
				.orderBy(asc(orderLines.id))
		: [];
	const byRef = new Map(rows.map((r) => [r.ref, r]));
	const found: SlipOrder[] = [];
	const missing: string[] = [];
	for (const ref of refs) {
		const o = byRef.get(ref);
		if (!o) {
			missing.push(ref);
			continue;
		}
		found.push({
			ref: o.ref,
			buyerName: o.buyerName,
			address: addressLines({ name: o.buyerName, ...o.address }),
			giftNote: o.giftNote,
			currency: o.currency,
			subtotalMinor: o.subtotalMinor,
			shippingMinor: o.shippingMinor,
			taxMinor: o.taxMinor,
			totalMinor: o.totalMinor,
			placedOn: isoDay(o.createdAt),
			readyBy: buyerReadyBy(o) ? readyByWords(buyerReadyBy(o)) : null,
			lines: lines
				.filter((l) => l.orderId === o.id)
				.map((l) => {
					const p = l.personalisation ?? null;
					return {
						title: l.title,
						woodName: l.woodName,
						quantity: l.quantity,
						unitPriceMinor: l.unitPriceMinor,
						lineTotalMinor: l.lineTotalMinor,
						initials: p?.initials ?? null,
						style: p?.style ?? null
					};
				})
		});
	}
	return { found, missing };
}

export async function slipShop(): Promise<SlipShop> {
	const s = await getShopInfo();
	return { name: s.name, email: s.email, address: addressLines(s.address) };
}
