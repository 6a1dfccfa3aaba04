/**
 * The workshop's view of one order: everything the carver and the helper need at the bench,
 * with each personalised line's layout recomputed from its stored snapshot (never a stored
 * drawing), in the line's wood and on the piece's blank.
 */
import { and, eq } from 'drizzle-orm';
import { computePattern, type PatternInput } from '$lib/pattern';
import { db } from './db';
import {
	orderLines,
	orders,
	pieces,
	shipments,
	woods,
	type Address,
	type Personalisation
} from './db/schema';
import { jsonValue } from './json-column';
import { letterFont } from '$lib/pattern/letter-font';

export type LineBlank = { widthMm: number; lengthMm: number; thicknessMm: number };

/**
 * Engine input for a stored snapshot. Single-rosette pieces store spacing 0 ("not used"), so a
 * missing or zero spacing falls back to the radius, as the shop does when it takes the order.
 */
export function snapshotInput(
	snap: Personalisation,
	blank: LineBlank,
	woodSlug: string
): PatternInput {
	return {
		diameterMm: snap.diameterMm,
		count: snap.count,
		spacingMm: snap.spacingMm || snap.diameterMm / 2,
		split: !!snap.split,
		initials: snap.initials,
		woodSlug,
		widthMm: blank.widthMm,
		lengthMm: blank.lengthMm,
		thicknessMm: blank.thicknessMm
	};
}

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
		address: jsonValue<Address>(order.address),
		giftNote: order.giftNote,
		currency: order.currency,
		subtotalMinor: order.subtotalMinor,
		shippingMinor: order.shippingMinor,
		taxMinor: order.taxMinor,
		totalMinor: order.totalMinor,
		refundedMinor: order.refundedMinor,
		checkoutSessionId: order.checkoutSessionId,
		paymentIntentId: order.paymentIntentId,
		readyBy: order.readyBy,
		createdAt: order.createdAt,
		paidAt: order.paidAt,
		shipments: ships.map((s) => ({
			id: s.id,
			carrier: s.carrier,
			trackingNumber: s.trackingNumber,
			shippedAt: s.shippedAt
		})),
		lines: lines.map((l) => {
			const snap = l.personalisation ? jsonValue<Personalisation>(l.personalisation) : null;
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
		personalisation: row.personalisation ? jsonValue<Personalisation>(row.personalisation) : null
	};
}
