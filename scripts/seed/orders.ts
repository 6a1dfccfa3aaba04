/**
 * The demo's orders, written through the same functions a real order goes through: the server's
 * personalisation run for the snapshot, `priceLines` for unit prices, per-line half-up tax and
 * shipping by billable weight (the cart and checkout price with it), and the shop's zones.
 */
import * as schema from '../../src/lib/server/db/schema';
import { priceLines } from '../../src/lib/server/cart/pricing';
import { personalise } from '../../src/lib/server/catalogue/personalise';
import { getSalesTax } from '../../src/lib/server/settings/sales-tax';
import { getCarvingSchedule } from '../../src/lib/server/queue/carving-queue';
import { addDays } from '../../src/lib/locale/dates';
import { WOODS, densityAt12 } from '../../src/lib/catalogue/woods';
import { DEMO_ORDERS } from './data/orders';
import { DEMO_PIECES, DEMO_SHIPPING_RATES } from './data/pieces';
import { WOOD_ADD_ON } from './data/woods';
import type { DemoSeedResult, SeedDb } from './types';

type Tx = Parameters<Parameters<SeedDb['transaction']>[0]>[0];

const DAY_MS = 86_400_000;
export const daysFromNow = (d: number, now: Date) => new Date(now.getTime() + d * DAY_MS);

/** One demo order line as the cart would hold it: the piece, the wood and the server's snapshot. */
function cartLine(line: (typeof DEMO_ORDERS)[number]['lines'][number]) {
	const piece = DEMO_PIECES.find((p) => p.slug === line.piece);
	const wood = WOODS.find((w) => w.slug === line.wood);
	if (!piece || !wood) throw new Error(`Demo order names an unknown piece or wood: ${line.piece}`);
	const [lengthMm, widthMm, thicknessMm] = piece.size;
	const blank = { pattern: piece.pattern, lengthMm, widthMm, thicknessMm };
	let personalisation = null;
	if (line.initials) {
		const style = line.style ?? (piece.pattern.split ? 'split' : 'classic');
		const run = personalise(blank, wood, { initials: line.initials, style });
		if (!run.ok) throw new Error(`Demo initials refused: ${JSON.stringify(run.fields)}`);
		personalisation = run.snapshot;
	}
	return {
		...blank,
		piece,
		wood,
		quantity: line.quantity,
		personalisation,
		kind: piece.kind,
		basePriceMinor: piece.basePriceMinor,
		woodSlug: wood.slug,
		densityKgM3: densityAt12(wood.specificGravity),
		priceAddOnMinor: WOOD_ADD_ON[wood.slug] ?? 0
	};
}

export async function seedOrders(
	tx: Tx,
	now: Date,
	{ pieceIds, woodIds, userIds }: DemoSeedResult
) {
	const { rateBp, basis: taxBasis } = await getSalesTax(tx);
	const schedule = await getCarvingSchedule(tx);
	for (const o of DEMO_ORDERS) {
		const created = daysFromNow(-o.daysAgo, now);
		const priced = priceLines(o.lines.map(cartLine), {
			rateBp,
			taxBasis,
			schedule,
			rates: DEMO_SHIPPING_RATES,
			country: o.address.country
		});
		if (!priced.shippingKnown) throw new Error(`Demo order ${o.ref} is too heavy for the rates`);
		const paid = o.status !== 'pending' && o.status !== 'cancelled';
		const lead = Math.max(...priced.lines.map((l) => l.piece.leadDays));
		const n = o.ref.slice(3);
		const [{ id }] = await tx
			.insert(schema.orders)
			.values({
				ref: o.ref,
				userId: o.customer ? userIds[o.email] : null,
				email: o.email,
				buyerName: o.buyer,
				address: o.address,
				giftNote: o.giftNote ?? null,
				currency: 'USD',
				subtotalMinor: priced.subtotalMinor,
				shippingMinor: priced.shippingMinor,
				taxMinor: priced.taxMinor,
				totalMinor: priced.totalMinor,
				status: o.status,
				checkoutSessionId: `cs_demo_${n}`,
				paymentIntentId: paid ? `pi_demo_${n}` : null,
				refundedMinor: o.status === 'refunded' ? priced.totalMinor : 0,
				readyBy: paid ? addDays(created, lead) : null,
				holdExpiresAt: o.status === 'pending' ? daysFromNow(1 / 48, now) : null,
				createdAt: created,
				paidAt: paid ? new Date(created.getTime() + 120_000) : null
			})
			.$returningId();
		await tx.insert(schema.orderLines).values(
			priced.lines.map((l) => ({
				orderId: id,
				pieceId: pieceIds[l.piece.slug],
				woodId: woodIds[l.wood.slug],
				title: l.piece.title,
				woodName: l.wood.name,
				quantity: l.quantity,
				unitPriceMinor: l.unitMinor,
				lineTotalMinor: l.totalMinor,
				fromStock: l.fromStock,
				personalisation: l.personalisation
			}))
		);
		if (o.shipment) {
			await tx.insert(schema.shipments).values({
				orderId: id,
				carrier: o.shipment.carrier,
				trackingNumber: o.shipment.trackingNumber,
				shippedAt: daysFromNow(-o.shipment.daysAgo, now)
			});
		}
	}
}
