/**
 * The orders table as a CSV file for a spreadsheet: the table's own filters and search (every
 * page of them, up to a limit), one row per order. UTF-8 with a byte-order mark, since Excel
 * reads a CSV without one in the machine's legacy code page and mangles "Łódź"; CRLF line ends
 * and doubled quotes as RFC 4180 has them (csv-stringify).
 */
import { stringify } from 'csv-stringify/sync';
import { desc, eq, sql } from 'drizzle-orm';
import { majorText } from '$lib/locale/money';
import { localIso } from '$lib/locale/dates';
import { statusLabel } from '$lib/orders/status';
import { csvText } from '$lib/orders/csv-safe';
import type { OrderTableQuery } from '$lib/orders/workshop-orders-schema';
import { db } from '../db';
import { orders } from '../db/schema';
import { cityOf, lineCounts, orderTableWhere } from './table';

/** More than a year of a busy one-person shop; a bigger export is narrowed by dates. */
export const EXPORT_LIMIT = 5000;

export const EXPORT_COLUMNS = [
	'reference',
	'placed_at',
	'status',
	'buyer',
	'email',
	'town',
	'country',
	'pieces',
	'personalised',
	'ready_by',
	'currency',
	'total',
	'refunded',
	'shipping',
	'sales_tax'
];

export async function ordersCsv(q: OrderTableQuery): Promise<string> {
	const { cond, personalised } = orderTableWhere(q);
	const rows = await db
		.select({
			ref: orders.ref,
			createdAt: orders.createdAt,
			status: orders.status,
			buyerName: orders.buyerName,
			email: orders.email,
			city: sql<string>`coalesce(${cityOf}, '')`,
			country: sql<string>`coalesce(json_unquote(json_extract(${orders.address}, '$.country')), '')`,
			pieces: sql<number>`coalesce(${lineCounts.pieces}, 0)`.mapWith(Number),
			personalised: sql<number>`${personalised}`.mapWith(Number),
			readyBy: orders.readyBy,
			currency: orders.currency,
			totalMinor: orders.totalMinor,
			refundedMinor: orders.refundedMinor,
			shippingMinor: orders.shippingMinor,
			taxMinor: orders.taxMinor
		})
		.from(orders)
		.leftJoin(lineCounts, eq(lineCounts.orderId, orders.id))
		.where(cond)
		.orderBy(desc(orders.createdAt), desc(orders.id))
		.limit(EXPORT_LIMIT);
	const body = rows.map((r) => {
		const money = (m: number) => majorText(m, r.currency);
		return [
			r.ref,
			localIso(r.createdAt),
			statusLabel(r.status),
			csvText(r.buyerName),
			csvText(r.email),
			csvText(r.city),
			r.country,
			r.pieces,
			r.personalised,
			r.readyBy ?? '',
			r.currency,
			money(r.totalMinor),
			money(r.refundedMinor),
			money(r.shippingMinor),
			money(r.taxMinor)
		];
	});
	return stringify(body, {
		header: true,
		columns: EXPORT_COLUMNS,
		bom: true,
		record_delimiter: 'windows'
	});
}
