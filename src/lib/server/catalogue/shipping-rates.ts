/**
 * The shipping rate table (zone × weight band → price) that the owner edits in settings.
 * Checkout's pricing reads the same `shipping_rates` rows.
 */
import { asc } from 'drizzle-orm';
import { db, type Db, type Tx } from '../db';
import { shippingRates } from '../db/schema';
import type { RateRow } from '$lib/catalogue/shipping';
import { transact } from '../db/retry';

/** Every band, by zone then weight: the input `shippingCharge` in $lib/catalogue/shipping expects. */
export async function readShippingRates(conn: Db | Tx = db): Promise<RateRow[]> {
	return conn
		.select({
			zone: shippingRates.zone,
			upToGrams: shippingRates.upToGrams,
			priceMinor: shippingRates.priceMinor
		})
		.from(shippingRates)
		.orderBy(asc(shippingRates.zone), asc(shippingRates.upToGrams));
}

/** Replaces the whole table at once, so a checkout never sees half the new bands. */
export async function replaceShippingRates(rows: RateRow[]) {
	await transact(async (tx) => {
		await tx.delete(shippingRates);
		if (rows.length) await tx.insert(shippingRates).values(rows);
	});
}
