/**
 * The workshop's order table: filtered, searched, sorted and paged in SQL, so the browser only
 * ever holds one page. Counts per order come from one grouped subquery joined on the order id
 * (a correlated count had bound the wrong table and said 5 for every order).
 */
import { and, asc, desc, gte, inArray, like, lt, or, sql, eq, type SQL } from 'drizzle-orm';
import type { OrderTableQuery, WorkshopOrderRow } from '$lib/schemas/workshop-orders';
import { addIsoDays } from '$lib/dates';
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

export async function listWorkshopOrders(q: OrderTableQuery) {
	const personalised = sql<number>`coalesce(${lineCounts.personalised}, 0)`;
	const where: SQL[] = [];
	if (q.status.length) where.push(inArray(orders.status, q.status));
	if (q.from) where.push(gte(orders.createdAt, new Date(`${q.from}T00:00:00Z`)));
	if (q.to) where.push(lt(orders.createdAt, new Date(`${addIsoDays(q.to, 1)}T00:00:00Z`)));
	if (q.personalised === 'yes') where.push(sql`${personalised} > 0`);
	if (q.personalised === 'no') where.push(sql`${personalised} = 0`);
	if (q.q) {
		const t = likeText(q.q);
		where.push(or(like(orders.ref, t), like(orders.buyerName, t), like(orders.email, t))!);
	}
	const cond = where.length ? and(...where) : undefined;

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
