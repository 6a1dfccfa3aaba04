/**
 * "Today" in the workshop: what needs carving, finishing, packing and posting, by ready-by date;
 * what is late; low stock; the next fair; and the carving queue with the day each line is due.
 * Ready-made orders are packed, never carved: they never count as "to carve".
 */
import { and, asc, eq, inArray, lte, sql } from 'drizzle-orm';
import { isoDay } from '$lib/locale/dates';
import type { OrderStatus } from '$lib/orders/status';
import { db } from '../db';
import { orders, pieces, stock, woods } from '../db/schema';
import { lineCounts } from '../orders/table';
import { carvingQueue } from '../queue/carving-queue';
import { comingFairs } from '../fairs/fairs';

/** Finished pieces at or under this count on the workshop shelf are "running low". */
export const LOW_STOCK = 1;

const BENCH: OrderStatus[] = [
	'paid',
	'deposit_held',
	'carving',
	'finishing',
	'packed',
	'piece_gone'
];

export type BenchOrder = {
	ref: string;
	buyerName: string;
	status: OrderStatus;
	readyBy: string | null;
	toCarve: number;
	late: boolean;
};

export async function todaySummary(now = new Date()) {
	const today = isoDay(now);
	const rows = await db
		.select({
			ref: orders.ref,
			buyerName: orders.buyerName,
			status: orders.status,
			readyBy: orders.readyBy,
			toCarve: sql<number>`coalesce(${lineCounts.toCarve}, 0)`.mapWith(Number)
		})
		.from(orders)
		.leftJoin(lineCounts, eq(lineCounts.orderId, orders.id))
		.where(inArray(orders.status, BENCH))
		.orderBy(sql`${orders.readyBy} is null`, asc(orders.readyBy), asc(orders.id));
	const bench: BenchOrder[] = rows.map((r) => ({
		...r,
		late: !!r.readyBy && r.readyBy < today && r.status !== 'piece_gone'
	}));
	const steps = {
		carve: bench.filter(
			(o) =>
				((o.status === 'paid' || o.status === 'deposit_held') && o.toCarve > 0) ||
				o.status === 'carving'
		),
		finish: bench.filter((o) => o.status === 'finishing'),
		pack: bench.filter((o) => o.status === 'paid' && o.toCarve === 0),
		post: bench.filter((o) => o.status === 'packed'),
		resolve: bench.filter((o) => o.status === 'piece_gone')
	};

	const [lowStock, comingList, queue] = await Promise.all([
		db
			.select({
				piece: pieces.title,
				slug: pieces.slug,
				wood: woods.name,
				quantity: stock.quantity
			})
			.from(stock)
			.innerJoin(pieces, eq(pieces.id, stock.pieceId))
			.innerJoin(woods, eq(woods.id, stock.woodId))
			.where(
				and(eq(stock.place, 'workshop'), lte(stock.quantity, LOW_STOCK), eq(pieces.active, true))
			)
			.orderBy(asc(stock.quantity), asc(pieces.title)),
		comingFairs(today),
		carvingQueue(now)
	]);

	return {
		today,
		steps,
		late: bench.filter((o) => o.late),
		lowStock,
		nextFair: comingList[0] ?? null,
		queue
	};
}
export type TodaySummary = Awaited<ReturnType<typeof todaySummary>>;
