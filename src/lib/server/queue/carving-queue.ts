/**
 * The carving queue read from the database: paid made-to-order lines not yet carved, in the
 * order the carver takes them (orders already on the bench first, then by payment time), with
 * their estimated minutes; the owner's carving week from settings; fair days as days off.
 * Scheduling itself is the pure `$lib/queue/carving-queue`.
 */
import { and, asc, eq, gte, inArray, isNotNull, isNull, notInArray, sql } from 'drizzle-orm';
import { z } from 'zod';
import { isoDay } from '$lib/locale/dates';
import {
	awayDays,
	daysBetween,
	DEFAULT_SCHEDULE,
	readyAfterCarving,
	readyByFor,
	scheduleQueue,
	type CarvingSchedule
} from '$lib/queue/carving-queue';
import { computePattern } from '$lib/pattern';
import { letterFont } from '$lib/pattern/letter-font';
import { db, type Db, type Tx } from '../db';
import { transact } from '../db/retry';
import {
	fairs,
	orderLines,
	orders,
	pieces,
	settings,
	woods,
	type Personalisation
} from '../db/schema';
import { snapshotInput } from '$lib/pattern/snapshot';
import { away as awaySchema } from '$lib/settings/settings-schema';

const KEY = 'carvingSchedule';
const minutes = z
	.number()
	.int()
	.min(0)
	.max(24 * 60);
const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2026-03-07.');

export const carvingScheduleSchema = z.object({
	minutesByWeekday: z.tuple([minutes, minutes, minutes, minutes, minutes, minutes, minutes]),
	daysOff: z.array(isoDate).max(366),
	finishingDays: z.number().int().min(0).max(60),
	packingDays: z.number().int().min(0).max(30),
	surchargePerMinuteMinor: z.number().int().min(0).max(10_000)
});

export async function getCarvingSchedule(conn: Db | Tx = db): Promise<CarvingSchedule> {
	const [row] = await conn.select().from(settings).where(eq(settings.key, KEY)).limit(1);
	const parsed = row ? carvingScheduleSchema.safeParse(row.value) : null;
	return parsed?.success ? parsed.data : DEFAULT_SCHEDULE;
}

export async function setCarvingSchedule(s: CarvingSchedule) {
	await db
		.insert(settings)
		.values({ key: KEY, value: s })
		.onDuplicateKeyUpdate({ set: { value: s } });
	await replanQueue();
}

/**
 * The owner's away date (Settings → Away): days off for the carving queue. Read here, not
 * through the settings module, because saving it there replans this queue.
 */
async function awayUntil(conn: Db | Tx): Promise<string> {
	const [row] = await conn.select().from(settings).where(eq(settings.key, 'away')).limit(1);
	const parsed = row ? awaySchema.safeParse(row.value) : null;
	return parsed?.success ? parsed.data.until : '';
}

/** Every day of every fair still to come: the carver is at the booth, not the bench. */
export async function fairDays(today: string, conn: Db | Tx = db): Promise<string[]> {
	const rows = await conn
		.select({ from: fairs.startsOn, to: fairs.endsOn })
		.from(fairs)
		.where(gte(fairs.endsOn, today));
	return rows.flatMap((f) => daysBetween(f.from < today ? today : f.from, f.to));
}

/** Minutes for one stored personalisation: the snapshot's estimate, or the engine's again. */
function lineMinutes(
	snap: Personalisation | null,
	blank: { widthMm: number; lengthMm: number; thicknessMm: number },
	woodSlug: string
): number {
	if (!snap) return 0;
	if (Number.isFinite(snap.estimateMinutes)) return Math.max(0, snap.estimateMinutes!);
	const r = computePattern(snapshotInput(snap, blank, woodSlug), {
		svg: false,
		font: letterFont()
	});
	return Math.round(r.estimateMinutes);
}

/** The statuses whose made-to-order lines wait in the carving queue. */
export const QUEUED_STATUSES = ['carving', 'paid', 'deposit_held'] as const;

export async function queueLines(conn: Db | Tx = db) {
	const rows = await conn
		.select({
			lineId: orderLines.id,
			orderId: orders.id,
			ref: orders.ref,
			status: orders.status,
			buyerName: orders.buyerName,
			title: orderLines.title,
			woodName: orderLines.woodName,
			quantity: orderLines.quantity,
			personalisation: orderLines.personalisation,
			widthMm: pieces.widthMm,
			lengthMm: pieces.lengthMm,
			thicknessMm: pieces.thicknessMm,
			woodSlug: woods.slug,
			paidAt: orders.paidAt
		})
		.from(orderLines)
		.innerJoin(orders, eq(orders.id, orderLines.orderId))
		.innerJoin(pieces, eq(pieces.id, orderLines.pieceId))
		.innerJoin(woods, eq(woods.id, orderLines.woodId))
		// Ready-made lines are packed, not carved: they never join the queue. A gone piece joins
		// only once the owner puts the order back on the bench (status carving).
		.where(and(eq(orderLines.fromStock, false), inArray(orders.status, [...QUEUED_STATUSES])))
		.orderBy(
			sql`case when ${orders.status} = 'carving' then 0 else 1 end`,
			asc(orders.paidAt),
			asc(orders.id),
			asc(orderLines.id)
		);
	return rows.map((r) => {
		const snap = r.personalisation ?? null;
		const each = lineMinutes(snap, r, r.woodSlug);
		return {
			lineId: r.lineId,
			orderId: r.orderId,
			ref: r.ref,
			status: r.status,
			buyerName: r.buyerName,
			title: r.title,
			woodName: r.woodName,
			quantity: r.quantity,
			initials: snap?.initials ?? null,
			minutes: each * r.quantity
		};
	});
}

export type QueueView = Awaited<ReturnType<typeof carvingQueue>>;

/** The queue with the day each line should be carved, for the "Today" page. */
export async function carvingQueue(now = new Date(), conn: Db | Tx = db) {
	const today = isoDay(now);
	const [lines, schedule, fairOff, away] = await Promise.all([
		queueLines(conn),
		getCarvingSchedule(conn),
		fairDays(today, conn),
		awayUntil(conn)
	]);
	// Fair days and the owner's away days are both days with no carving.
	const daysOff = [...new Set([...fairOff, ...awayDays(today, away)])].sort();
	const planned = scheduleQueue(
		lines.map((l) => ({ key: l, minutes: l.minutes })),
		schedule,
		today,
		daysOff
	);
	return {
		today,
		schedule,
		fairDays: fairOff,
		awayUntil: away,
		daysOff,
		totalMinutes: lines.reduce((s, l) => s + l.minutes, 0),
		lines: planned.map((p) => ({ ...p.key, carvedOn: p.carvedOn }))
	};
}

/**
 * Gives every order in the queue its ready-by date from its place in it: the day its last line
 * is carved, plus finishing and packing. Run by `replanQueue` after anything it depends on
 * changes. Orders of ready-made pieces are left as they are.
 */
export async function recomputeReadyBy(now = new Date(), conn: Db | Tx = db) {
	const q = await carvingQueue(now, conn);
	const lastDay = new Map<number, string | null>();
	for (const l of q.lines) lastDay.set(l.orderId, l.carvedOn);
	const dated = new Map<number, string | null>();
	for (const [orderId, carvedOn] of lastDay) {
		const readyBy = carvedOn ? readyAfterCarving(carvedOn, q.schedule, q.daysOff) : null;
		await conn.update(orders).set({ readyBy }).where(eq(orders.id, orderId));
		dated.set(orderId, readyBy);
	}
	return dated;
}

/**
 * After a change the plan depends on has committed (an order joins, leaves or moves up the
 * queue, new carving hours, away days or shop clock, a fair added or moved): every queued
 * order's ready-by date again, in one retried transaction. The domain calls it, never a route.
 * It never fails the change that called it: a failure is logged and the next change plans again.
 */
export async function replanQueue(now = new Date()) {
	try {
		await transact((tx) => recomputeReadyBy(now, tx));
	} catch (err) {
		console.error('ready-by recompute failed', err);
	}
}

/**
 * The one ready-by date for an order joining the queue now with `carvedMinutes` of carving
 * (0 for ready-made pieces, which only wait for packing). The piece page, the basket, checkout
 * and the pending order all date with this, so they agree with the date given at payment.
 */
export async function readyByNow(carvedMinutes: number, now = new Date(), conn: Db | Tx = db) {
	const q = await queueOutlook(now, conn);
	return readyByFor(q.minutesAhead, carvedMinutes, q.schedule, q.today, q.extraDaysOff);
}

/** Carving minutes of priced lines (made-to-order ones, times their quantity). */
export function carvedMinutes(
	lines: {
		fromStock: boolean;
		quantity: number;
		personalisation: { estimateMinutes?: number } | null;
	}[]
) {
	return lines
		.filter((l) => !l.fromStock)
		.reduce((m, l) => m + (l.personalisation?.estimateMinutes ?? 0) * l.quantity, 0);
}

/**
 * A just-paid order: its date from its place in the queue (everything paid before it ahead),
 * then kept as the buyer's promise (`promisedBy`), which the paid e-mail, the owner's alert,
 * the buyer's order page and the slips all show.
 *
 * Why kept: a buyer plans around the day in the paid e-mail (often a gift for a set day). Later
 * moves of the queue (a status step, new carving hours, a fair, an order put back on the bench)
 * change the workshop's plan (`readyBy`, on Today and in the orders table) but not what the
 * buyer was told: a promise that slides later without a word breaks trust, and one that jumps
 * earlier and back again is as confusing. When the plan runs past the promise, the workshop
 * sees it and writes to the buyer.
 */
export async function promiseReadyBy(orderId: number, now = new Date(), conn: Db | Tx = db) {
	// Only this order is dated here, inside the payment's transaction, so the paid e-mail and the
	// owner's alert written in that transaction state it; the other orders' plans are worked out
	// again after the commit (replanQueue), so a payment never locks every queued order.
	const q = await carvingQueue(now, conn);
	let readyBy: string | null | undefined;
	for (const l of q.lines) {
		if (l.orderId !== orderId) continue;
		readyBy = l.carvedOn ? readyAfterCarving(l.carvedOn, q.schedule, q.daysOff) : null;
	}
	if (readyBy !== undefined) {
		await conn.update(orders).set({ readyBy }).where(eq(orders.id, orderId));
	} else {
		// Nothing of it to carve (ready-made, or already carved): packing days from today.
		readyBy = await readyByNow(0, now, conn);
		await conn.update(orders).set({ readyBy }).where(eq(orders.id, orderId));
	}
	await conn
		.update(orders)
		.set({ promisedBy: readyBy })
		.where(and(eq(orders.id, orderId), isNull(orders.promisedBy)));
	return readyBy;
}

/** Paid orders without a promise yet (the demo's, or older ones) keep today's plan as it. */
export async function keepPlansAsPromises(conn: Db | Tx = db) {
	await conn
		.update(orders)
		.set({ promisedBy: sql`${orders.readyBy}` })
		.where(
			and(
				isNull(orders.promisedBy),
				isNotNull(orders.readyBy),
				notInArray(orders.status, ['pending', 'cancelled'])
			)
		);
}

/** What the personaliser needs to date a new piece in the browser with the same rules. */
export async function queueOutlook(now = new Date(), conn: Db | Tx = db) {
	const q = await carvingQueue(now, conn);
	return {
		today: q.today,
		minutesAhead: q.totalMinutes,
		schedule: q.schedule,
		extraDaysOff: q.daysOff
	};
}
export type QueueOutlook = Awaited<ReturnType<typeof queueOutlook>>;

/**
 * The day each personalised basket line would be ready to post if ordered now: its layout's
 * minutes (times the quantity) joining the queue as it stands, as the piece page dates it.
 */
export async function basketReadyBy(
	lines: { id: number; quantity: number; personalisation: { estimateMinutes?: number } | null }[],
	now = new Date()
): Promise<Record<number, string | null>> {
	const carved = lines.filter((l) => l.personalisation);
	if (!carved.length) return {};
	const q = await queueOutlook(now);
	// Each line as if it joined the queue alone; the order as a whole is dated by readyByNow.
	return Object.fromEntries(
		carved.map((l) => [
			l.id,
			readyByFor(
				q.minutesAhead,
				(l.personalisation!.estimateMinutes ?? 0) * l.quantity,
				q.schedule,
				q.today,
				q.extraDaysOff
			)
		])
	);
}
