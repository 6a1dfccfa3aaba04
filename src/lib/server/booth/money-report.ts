import { isoMonth } from '$lib/locale/dates';
import { eq, isNotNull } from 'drizzle-orm';
import { stringify } from 'csv-stringify/sync';
import { db } from '../db';
import { boothSales, fairs, orders } from '../db/schema';
import { decimal } from './fair-report';
import { fairTally } from './tally';

const PAID = new Set([
	'paid',
	'deposit_held',
	'carving',
	'finishing',
	'packed',
	'shipped',
	'refunded'
]);
const month = (d: Date) => isoMonth(d);

export type MoneyRow = {
	month: string;
	channel: 'online' | 'fair orders' | 'fair sales';
	salesMinor: number;
	taxMinor: number;
	refundsMinor: number;
};

/**
 * The owner's books across channels: sales (before tax) by month and channel, sales tax
 * collected by place, refunds, and fair fees and costs. Orders taken at a booth count as
 * "fair orders"; pieces sold off the table as "fair sales".
 */
export async function moneyReport() {
	const [orderRows, boothOrderIds, fairRows] = await Promise.all([
		db
			.select({
				id: orders.id,
				status: orders.status,
				createdAt: orders.createdAt,
				paidAt: orders.paidAt,
				subtotal: orders.subtotalMinor,
				tax: orders.taxMinor,
				refunded: orders.refundedMinor,
				address: orders.address
			})
			.from(orders),
		db
			.select({ orderId: boothSales.orderId, place: fairs.place })
			.from(boothSales)
			.innerJoin(fairs, eq(fairs.id, boothSales.fairId))
			.where(isNotNull(boothSales.orderId)),
		db.select({ id: fairs.id }).from(fairs).orderBy(fairs.startsOn)
	]);
	// A booth order's sales tax is due where the fair was, not where it is posted.
	const fromBooth = new Map(boothOrderIds.map((r) => [r.orderId, r.place]));
	const rows = new Map<string, MoneyRow>();
	const row = (m: string, channel: MoneyRow['channel']) => {
		const key = `${m}|${channel}`;
		if (!rows.has(key))
			rows.set(key, { month: m, channel, salesMinor: 0, taxMinor: 0, refundsMinor: 0 });
		return rows.get(key)!;
	};
	const taxByPlace = new Map<string, number>();
	const addTax = (place: string, minor: number) =>
		taxByPlace.set(place, (taxByPlace.get(place) ?? 0) + minor);

	for (const o of orderRows) {
		if (!PAID.has(o.status)) continue;
		const r = row(month(o.paidAt ?? o.createdAt), fromBooth.has(o.id) ? 'fair orders' : 'online');
		r.salesMinor += o.subtotal;
		r.taxMinor += o.tax;
		r.refundsMinor += o.refunded;
		const a = o.address;
		const fairPlace = fromBooth.get(o.id);
		if (o.tax > 0)
			addTax(
				fairPlace !== undefined
					? `Fair: ${fairPlace}`
					: `Online: ${[a.region, a.country].filter(Boolean).join(', ')}`,
				o.tax
			);
	}
	const fairCosts = [];
	for (const { id } of fairRows) {
		const t = await fairTally(id);
		for (const e of t.entries.filter((x) => x.kind === 'sale' && !x.voidedAt)) {
			const r = row(month(e.soldAt), 'fair sales');
			r.salesMinor += e.totalMinor - e.taxMinor;
			r.taxMinor += e.taxMinor;
		}
		if (t.result.taxDue > 0) addTax(`Fair: ${t.fair.place}`, t.result.taxDue);
		fairCosts.push({
			name: t.fair.name,
			startsOn: t.fair.startsOn,
			boothFeeMinor: t.fair.boothFeeMinor,
			otherCostsMinor: t.fair.otherCostsMinor,
			cardFeeMinor: t.result.card.fee
		});
	}
	const byMonth = [...rows.values()].sort(
		(a, b) => a.month.localeCompare(b.month) || a.channel.localeCompare(b.channel)
	);
	return {
		byMonth,
		taxByPlace: [...taxByPlace.entries()].map(([place, taxMinor]) => ({ place, taxMinor })),
		fairCosts,
		totals: {
			salesMinor: byMonth.reduce((a, r) => a + r.salesMinor, 0),
			taxMinor: byMonth.reduce((a, r) => a + r.taxMinor, 0),
			refundsMinor: byMonth.reduce((a, r) => a + r.refundsMinor, 0),
			feesMinor: fairCosts.reduce(
				(a, f) => a + f.boothFeeMinor + f.otherCostsMinor + f.cardFeeMinor,
				0
			)
		}
	};
}

export function moneyCsv(r: Awaited<ReturnType<typeof moneyReport>>): string {
	return stringify(
		r.byMonth.map((m) => [
			m.month,
			m.channel,
			decimal(m.salesMinor),
			decimal(m.taxMinor),
			decimal(m.refundsMinor)
		]),
		{
			header: true,
			columns: ['month', 'channel', 'sales_before_tax', 'sales_tax', 'refunds'],
			record_delimiter: '\r\n'
		}
	);
}
