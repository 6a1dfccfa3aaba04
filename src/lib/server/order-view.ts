import { inArray } from 'drizzle-orm';
import { db } from './db';
import { pieces, woods } from './db/schema';
import { previewSvg } from './personalise';
import type { OrderDetail } from './orders';
import { orderPath } from './order-links';

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
		giftNote: order.giftNote,
		currency: order.currency,
		subtotalMinor: order.subtotalMinor,
		shippingMinor: order.shippingMinor,
		taxMinor: order.taxMinor,
		totalMinor: order.totalMinor,
		refundedMinor: order.refundedMinor,
		readyBy: order.readyBy,
		createdAt: order.createdAt,
		paidAt: order.paidAt,
		link: orderPath(order.ref),
		shipments: order.shipments.map((s) => ({
			carrier: s.carrier,
			trackingNumber: s.trackingNumber,
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
