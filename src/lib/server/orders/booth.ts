/**
 * An order taken at a fair's booth for a piece carved to order: the orders module writes it like
 * any other order (the order row, its line with the server's own personalisation snapshot, and
 * its history), paid in part: the deposit taken at the booth, the rest owed before it ships.
 * The caller (the booth) owns the transaction, so its own entry for the deposit and this order
 * are stored together or not at all.
 */
import type { Tx } from '../db';
import { orderHistory, orderLines, orders, type Address } from '../db/schema';
import { personalise } from '../catalogue/personalise';
import { personalisedPriceMinor } from '$lib/catalogue/personalised-price';
import { priceSale } from '$lib/booth/reconcile';
import { shippingCharge, type RateRow } from '$lib/catalogue/shipping';
import { uniqueRef } from './place';
import type { PiecePattern } from '../db/schema';
import { DomainError } from '../errors/domain-error';

export type BoothOrderInput = {
	piece: {
		id: number;
		title: string;
		kind: string;
		personalisable: boolean;
		basePriceMinor: number;
		pattern: PiecePattern;
		widthMm: number;
		lengthMm: number;
		thicknessMm: number;
	};
	wood: {
		id: number;
		name: string;
		slug: string;
		priceAddOnMinor: number;
		densityKgM3: number;
		toneLight: string;
		toneDark: string;
	};
	initials: string;
	buyer: { name: string; email: string; address: Address };
	/** Where it was taken: the fair's name, currency and sales tax. */
	fair: { name: string; currency: string; salesTaxBp: number; pricesIncludeTax: boolean };
	depositMinor: number;
	/** Collected from the workshop, or posted at the shop's shipping rates. */
	delivery: 'post' | 'collect';
	rates: RateRow[];
	takenBy: string | null;
	now?: Date;
};

/**
 * Writes the booth order; returns its id, reference and total. Refuses (DomainError 400) a piece
 * that is not carved to order, initials that do not fit, or a deposit above the total.
 */
export async function placeBoothOrder(tx: Tx, o: BoothOrderInput) {
	if (!o.piece.personalisable)
		throw new DomainError(400, `${o.piece.title} is not carved to order.`);
	const made = personalise(o.piece, o.wood, { initials: o.initials });
	if (!made.ok)
		throw new DomainError(400, Object.values(made.fields)[0]?.[0] ?? 'Those initials do not fit.');
	const unit = personalisedPriceMinor(o.piece.basePriceMinor, o.wood.priceAddOnMinor);
	const priced = priceSale(
		[{ unitMinor: unit, quantity: 1 }],
		0,
		o.fair.salesTaxBp,
		o.fair.pricesIncludeTax
	);
	let shippingMinor = 0;
	if (o.delivery === 'post') {
		const ship = shippingCharge(o.rates, o.buyer.address.country, [
			{ size: o.piece, densityKgM3: o.wood.densityKgM3, quantity: 1 }
		]);
		if (ship.priceMinor === null)
			throw new DomainError(
				400,
				'The shop has no shipping rate to that country for this piece; choose collect.'
			);
		shippingMinor = ship.priceMinor;
	}
	const totalMinor = priced.totalMinor + shippingMinor;
	if (o.depositMinor > totalMinor) {
		throw new DomainError(400, 'The deposit is more than the order’s total.');
	}
	const now = o.now ?? new Date();
	const paidInFull = o.depositMinor === totalMinor;
	const status = paidInFull ? 'paid' : 'deposit_held';
	const ref = await uniqueRef(tx);
	const [{ id }] = await tx
		.insert(orders)
		.values({
			ref,
			email: o.buyer.email,
			buyerName: o.buyer.name,
			address: o.buyer.address,
			currency: o.fair.currency,
			subtotalMinor: priced.taxableMinor,
			shippingMinor,
			taxMinor: priced.taxMinor,
			totalMinor,
			depositMinor: o.depositMinor,
			// A deposit of the whole total leaves nothing owed: the balance is paid with it.
			balancePaidAt: paidInFull ? now : null,
			status,
			delivery: o.delivery,
			createdAt: now,
			paidAt: now
		})
		.$returningId();
	await tx.insert(orderLines).values({
		orderId: id,
		pieceId: o.piece.id,
		woodId: o.wood.id,
		title: o.piece.title,
		woodName: o.wood.name,
		quantity: 1,
		// Net of tax, so the order's lines add up to its subtotal as online orders do.
		unitPriceMinor: priced.taxableMinor,
		lineTotalMinor: priced.taxableMinor,
		fromStock: false,
		personalisation: made.snapshot
	});
	// Born with its deposit in hand (or paid in full); its history says where and by whom.
	await tx.insert(orderHistory).values({
		orderId: id,
		fromStatus: 'pending',
		toStatus: status,
		userId: o.takenBy,
		reason:
			`Ordered at ${o.fair.name}; ${paidInFull ? 'paid in full' : 'deposit taken, balance due'}`.slice(
				0,
				500
			),
		createdAt: now
	});
	return { id, ref, totalMinor };
}
