/**
 * The workshop's order table: filtered, searched, sorted and paged in SQL, so the browser only
 * ever holds one page. Counts per order come from one grouped subquery joined on the order id
 * (a correlated count had bound the wrong table and said 5 for every order).
 */
import { and, asc, desc, gte, inArray, like, lt, or, sql, eq, type SQL } from 'drizzle-orm';
import type { OrderTableQuery, WorkshopOrderRow } from '$lib/orders/workshop-orders-schema';
import { addIsoDays } from '$lib/locale/dates';
import { db } from '../db';
import { orderLines, orders } from '../db/schema';

/** Per order: personalised pieces, pieces to carve (made to order) and all pieces. */
export const lineCounts = db
	.select({
		orderId: orderLines.orderId,
		personalised:
			sql<number>`sum(case when ${orderLines.personalisation} is not null then ${orderLines.quantity} else 0 end)`.as(
				'personalised'
			),
		toCarve:
			sql<number>`sum(case when ${orderLines.fromStock} = false then ${orderLines.quantity} else 0 end)`.as(
				'to_carve'
			),
		pieces: sql<number>`sum(${orderLines.quantity})`.as('pieces')
	})
	.from(orderLines)
	.groupBy(orderLines.orderId)
	.as('lc');

/** `%`, `_` and `\` typed in the search box are meant literally. */
const likeText = (s: string) => `%${s.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** The buyer's town, from the address JSON, compared without regard to case. */
export const cityOf = sql<string>`convert(json_unquote(json_extract(${orders.address}, '$.city')) using utf8mb4) collate utf8mb4_unicode_ci`;

const unpaidCancel = sql`(${orders.status} = 'cancelled' and ${orders.paidAt} is null)`;

/** The view's own condition (see `orderViews`): abandoned checkouts only under their filter. */
function viewCondition(view: OrderTableQuery['view']): SQL {
	const abandoned = sql`(${orders.status} = 'pending' or ${unpaidCancel})`;
	switch (view) {
		case 'action':
			return inArray(orders.status, ['paid', 'carving', 'finishing', 'packed', 'piece_gone']);
		case 'closed':
			return sql`(${orders.status} in ('shipped', 'refunded') or (${orders.status} = 'cancelled' and ${orders.paidAt} is not null))`;
		case 'abandoned':
			return abandoned;
		case 'all':
			return sql`not ${abandoned}`;
	}
}

/** The table's filters and search as one condition, shared by the page and the CSV export. */
export function orderTableWhere(q: OrderTableQuery) {
	const personalised = sql<number>`coalesce(${lineCounts.personalised}, 0)`;
	const where: SQL[] = [viewCondition(q.view)];
	if (q.status.length) where.push(inArray(orders.status, q.status));
	if (q.from) where.push(gte(orders.createdAt, new Date(`${q.from}T00:00:00Z`)));
	if (q.to) where.push(lt(orders.createdAt, new Date(`${addIsoDays(q.to, 1)}T00:00:00Z`)));
	if (q.personalised === 'yes') where.push(sql`${personalised} > 0`);
	if (q.personalised === 'no') where.push(sql`${personalised} = 0`);
	if (q.q) {
		const t = likeText(q.q);
		// The initials carved on any line of the order, as stored in its personalisation snapshot.
		const initials = sql`exists (select 1 from ${orderLines} where ${orderLines.orderId} = ${orders.id}
			and convert(json_unquote(json_extract(${orderLines.personalisation}, '$.initials')) using utf8mb4) collate utf8mb4_unicode_ci like ${t})`;
		where.push(
			or(
				like(orders.ref, t),
				like(orders.buyerName, t),
				like(orders.email, t),
				sql`${cityOf} like ${t}`,
				initials
			)!
		);
	}
	return { cond: and(...where), personalised };
}

export async function listWorkshopOrders(q: OrderTableQuery) {
	const { cond, personalised } = orderTableWhere(q);

	const sortCol = {
		ref: orders.ref,
		createdAt: orders.createdAt,
		buyerName: orders.buyerName,
		status: orders.status,
		readyBy: orders.readyBy,
		totalMinor: orders.totalMinor,
		personalised
	}[q.sort];
	const dir = q.dir === 'asc' ? asc : desc;

	const [rows, [{ total }]] = await Promise.all([
		db
			.select({
				ref: orders.ref,
				buyerName: orders.buyerName,
				email: orders.email,
				status: orders.status,
				createdAt: orders.createdAt,
				readyBy: orders.readyBy,
				totalMinor: orders.totalMinor,
				refundedMinor: orders.refundedMinor,
				currency: orders.currency,
				city: sql<string>`coalesce(${cityOf}, '')`,
				personalised: sql<number>`${personalised}`.mapWith(Number),
				toCarve: sql<number>`coalesce(${lineCounts.toCarve}, 0)`.mapWith(Number),
				pieces: sql<number>`coalesce(${lineCounts.pieces}, 0)`.mapWith(Number)
			})
			.from(orders)
			.leftJoin(lineCounts, eq(lineCounts.orderId, orders.id))
			.where(cond)
			.orderBy(dir(sortCol), dir(orders.id))
			.limit(q.size)
			.offset((q.page - 1) * q.size),
		db
			.select({ total: sql<number>`count(*)`.mapWith(Number) })
			.from(orders)
			.leftJoin(lineCounts, eq(lineCounts.orderId, orders.id))
			.where(cond)
	]);
	return {
		rows: rows.map((r): WorkshopOrderRow => ({ ...r, createdAt: r.createdAt.toISOString() })),
		total,
		pages: Math.max(1, Math.ceil(total / q.size))
	};
}
