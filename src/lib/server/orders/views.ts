/**
 * Reading orders: the buyer's view (no payment ids, no internal fields), the workshop's list and
 * its view of one order, with each personalised line's layout recomputed from its stored
 * snapshot (never a stored drawing), in the line's wood and on the piece's blank.
 */
import { and, desc, eq, getTableColumns, inArray, sql } from 'drizzle-orm';
import { computePattern } from '$lib/pattern';
import { letterFont } from '$lib/pattern/letter-font';
import { snapshotInput } from '$lib/pattern/snapshot';
import { buyerReadyBy } from '$lib/queue/carving-queue';
import { unprintable } from '../pdf/fonts';
import { db, type Db, type Tx } from '../db';
import { orderLines, orders, pieces, shipments, woods } from '../db/schema';
import { previewSvg } from '../catalogue/personalise';
import { orderPath } from './links';
import { trackingLink } from './tracking';

/** The order with its lines and shipments, for the buyer's page and the e-mail. */
export async function orderByRef(ref: string) {
	const [order] = await db.select().from(orders).where(eq(orders.ref, ref));
	if (!order) return null;
	return withDetails(order);
}

/** `conn` is a transaction when the caller must see its own uncommitted change (the e-mails). */
export async function orderById(id: number, conn: Db | Tx = db) {
	const [order] = await conn.select().from(orders).where(eq(orders.id, id));
	return order ? withDetails(order, conn) : null;
}

export async function orderBySession(sessionId: string) {
	const [order] = await db.select().from(orders).where(eq(orders.checkoutSessionId, sessionId));
	return order ? withDetails(order) : null;
}

async function withDetails(order: typeof orders.$inferSelect, conn: Db | Tx = db) {
	// One after the other: a transaction's connection runs one query at a time anyway.
	const lines = await conn
		.select({
			...getTableColumns(orderLines),
			kind: pieces.kind,
			foodContact: pieces.foodContact
		})
		.from(orderLines)
		.innerJoin(pieces, eq(pieces.id, orderLines.pieceId))
		.where(eq(orderLines.orderId, order.id))
		.orderBy(orderLines.id);
	const ships = await conn
		.select()
		.from(shipments)
		.where(eq(shipments.orderId, order.id))
		.orderBy(desc(shipments.shippedAt));
	return {
		...order,
		address: order.address,
		lines: lines.map((l) => ({
			...l,
			personalisation: l.personalisation ?? null
		})),
		shipments: ships
	};
}

export type OrderDetail = NonNullable<Awaited<ReturnType<typeof orderByRef>>>;

/** A signed-in buyer's orders, newest first (abandoned checkouts left out). */
export async function ordersForUser(userId: string) {
	return db
		.select({
			ref: orders.ref,
			status: orders.status,
			totalMinor: orders.totalMinor,
			currency: orders.currency,
			createdAt: orders.createdAt,
			readyBy: sql<string | null>`coalesce(${orders.promisedBy}, ${orders.readyBy})`
		})
		.from(orders)
		.where(and(eq(orders.userId, userId), sql`${orders.status} not in ('pending', 'cancelled')`))
		.orderBy(desc(orders.createdAt), desc(orders.id));
}

/** The workshop's first order list: every order that got past checkout, newest first. */
export async function workshopOrders(limit = 200) {
	return db
		.select({
			ref: orders.ref,
			buyerName: orders.buyerName,
			email: orders.email,
			totalMinor: orders.totalMinor,
			currency: orders.currency,
			status: orders.status,
			createdAt: orders.createdAt,
			readyBy: orders.readyBy,
			// Raw names on purpose: inside a subquery an unqualified `id` would bind to order_lines.
			personalised: sql<number>`(select count(*) from order_lines ol
				where ol.order_id = orders.id and ol.personalisation is not null)`.mapWith(Number)
		})
		.from(orders)
		.orderBy(desc(orders.createdAt), desc(orders.id))
		.limit(limit);
}

/** What both the buyer and the workshop see of an order: its note and its money. */
function orderFigures(order: typeof orders.$inferSelect) {
	return {
		giftNote: order.giftNote,
		currency: order.currency,
		subtotalMinor: order.subtotalMinor,
		shippingMinor: order.shippingMinor,
		taxMinor: order.taxMinor,
		totalMinor: order.totalMinor,
		refundedMinor: order.refundedMinor
	};
}

/** What a buyer's order page shows: no payment ids, no internal fields. */
export async function buyerOrderView(order: OrderDetail) {
	const pieceRows = await db
		.select({
			id: pieces.id,
			slug: pieces.slug,
			widthMm: pieces.widthMm,
			lengthMm: pieces.lengthMm,
			thicknessMm: pieces.thicknessMm
		})
		.from(pieces)
		.where(inArray(pieces.id, [0, ...order.lines.map((l) => l.pieceId)]));
	const woodRows = await db
		.select({
			id: woods.id,
			slug: woods.slug,
			toneLight: woods.toneLight,
			toneDark: woods.toneDark
		})
		.from(woods)
		.where(inArray(woods.id, [0, ...order.lines.map((l) => l.woodId)]));
	return {
		ref: order.ref,
		status: order.status,
		buyerName: order.buyerName,
		email: order.email,
		address: order.address,
		...orderFigures(order),
		readyBy: buyerReadyBy(order),
		createdAt: order.createdAt,
		paidAt: order.paidAt,
		link: orderPath(order.ref),
		shipments: order.shipments.map((s) => ({
			carrier: s.carrier,
			trackingNumber: s.trackingNumber,
			// The carrier's own tracking page; null for a local courier with no public one.
			trackingUrl: trackingLink(s.carrier, s.trackingNumber),
			shippedAt: s.shippedAt
		})),
		lines: order.lines.map((l) => {
			const piece = pieceRows.find((p) => p.id === l.pieceId);
			const wood = woodRows.find((w) => w.id === l.woodId);
			return {
				id: l.id,
				title: l.title,
				slug: piece?.slug,
				woodName: l.woodName,
				quantity: l.quantity,
				unitPriceMinor: l.unitPriceMinor,
				lineTotalMinor: l.lineTotalMinor,
				fromStock: l.fromStock,
				personalisation: l.personalisation,
				previewSvg:
					l.personalisation && piece && wood
						? previewSvg(l.personalisation, wood, piece, `ov${l.id}`)
						: null
			};
		})
	};
}

export type BuyerOrderView = Awaited<ReturnType<typeof buyerOrderView>>;

const lineColumns = {
	id: orderLines.id,
	title: orderLines.title,
	woodName: orderLines.woodName,
	quantity: orderLines.quantity,
	unitPriceMinor: orderLines.unitPriceMinor,
	lineTotalMinor: orderLines.lineTotalMinor,
	fromStock: orderLines.fromStock,
	personalisation: orderLines.personalisation,
	pieceSlug: pieces.slug,
	widthMm: pieces.widthMm,
	lengthMm: pieces.lengthMm,
	thicknessMm: pieces.thicknessMm,
	woodSlug: woods.slug
};

export async function workshopOrderDetail(ref: string) {
	const [order] = await db.select().from(orders).where(eq(orders.ref, ref));
	if (!order) return null;
	const [lines, ships] = await Promise.all([
		db
			.select(lineColumns)
			.from(orderLines)
			.innerJoin(pieces, eq(pieces.id, orderLines.pieceId))
			.innerJoin(woods, eq(woods.id, orderLines.woodId))
			.where(eq(orderLines.orderId, order.id))
			.orderBy(orderLines.id),
		db.select().from(shipments).where(eq(shipments.orderId, order.id)).orderBy(shipments.shippedAt)
	]);
	const font = letterFont();
	return {
		ref: order.ref,
		status: order.status,
		buyerName: order.buyerName,
		email: order.email,
		address: order.address,
		...orderFigures(order),
		checkoutSessionId: order.checkoutSessionId,
		paymentIntentId: order.paymentIntentId,
		depositMinor: order.depositMinor,
		balancePaidAt: order.balancePaidAt,
		balanceMethod: order.balanceMethod,
		readyBy: order.readyBy,
		promisedBy: order.promisedBy,
		// Characters no font in the slips has: they print as a placeholder, so the owner is told.
		unprintable: unprintable(
			[order.buyerName, order.giftNote, ...Object.values(order.address ?? {})]
				.filter((v) => typeof v === 'string')
				.join(' ')
		),
		createdAt: order.createdAt,
		paidAt: order.paidAt,
		shipments: ships.map((s) => ({
			id: s.id,
			carrier: s.carrier,
			trackingNumber: s.trackingNumber,
			shippedAt: s.shippedAt
		})),
		lines: lines.map((l) => {
			const snap = l.personalisation ?? null;
			const input = snap ? snapshotInput(snap, l, l.woodSlug) : null;
			// The carving close up (what the carver checks), and the whole blank small beside it.
			const pattern = input
				? computePattern(input, { font, idPrefix: `wo${l.id}`, closeUpMm: 6 })
				: null;
			const wholeSvg = input ? computePattern(input, { font, idPrefix: `wow${l.id}` }).svg : null;
			return {
				id: l.id,
				title: l.title,
				pieceSlug: l.pieceSlug,
				woodName: l.woodName,
				quantity: l.quantity,
				unitPriceMinor: l.unitPriceMinor,
				lineTotalMinor: l.lineTotalMinor,
				fromStock: l.fromStock,
				blank: { widthMm: l.widthMm, lengthMm: l.lengthMm, thicknessMm: l.thicknessMm },
				personalisation: snap,
				pattern: pattern && {
					svg: pattern.svg,
					wholeSvg: wholeSvg ?? '',
					chipCount: pattern.chipCount,
					letterCount: pattern.letterCount,
					compassRadiusMm: pattern.compassRadiusMm,
					cutLengthMm: Math.round(pattern.cutLengthMm),
					estimateMinutes: Math.round(pattern.estimateMinutes),
					warnings: pattern.warnings
				}
			};
		})
	};
}

export type WorkshopOrderDetail = NonNullable<Awaited<ReturnType<typeof workshopOrderDetail>>>;

/** One line of one order with what its template needs; null when either is unknown. */
export async function orderLineForTemplate(ref: string, lineId: number) {
	const [row] = await db
		.select({ ...lineColumns, ref: orders.ref })
		.from(orderLines)
		.innerJoin(orders, eq(orders.id, orderLines.orderId))
		.innerJoin(pieces, eq(pieces.id, orderLines.pieceId))
		.innerJoin(woods, eq(woods.id, orderLines.woodId))
		.where(and(eq(orders.ref, ref), eq(orderLines.id, lineId)));
	if (!row) return null;
	return {
		...row,
		personalisation: row.personalisation ?? null
	};
}
