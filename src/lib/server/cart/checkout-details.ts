/**
 * What the buyer typed at checkout, kept on the server against their basket (never in a URL),
 * so coming back from a declined card or a cancelled payment page finds the form filled and
 * they only try another card. It is personal data, so it lives no longer than the basket.
 */
import { eq, lt } from 'drizzle-orm';
import { db, type Db, type Tx } from '../db';
import { carts, checkoutDetails, type Address } from '../db/schema';
import { transact } from '../db/retry';
import { lockCart } from './lock';
import { startOncePerInterval } from '../jobs/once-per-interval';

/** How long the basket cookie lasts (set once, when the basket is made): the details no longer. */
export const BASKET_LIFETIME_MS = 30 * 24 * 60 * 60 * 1000;

export type CheckoutDetails = {
	name: string;
	email: string;
	address: Address;
	giftNote: string | null;
};

/**
 * Stores (or replaces) the basket's details. Saved before the order is attempted, so they
 * survive a checkout that cannot go ahead (a piece sold out, the payment service down) too.
 * A basket that no longer exists stores nothing.
 */
export async function saveCheckoutDetails(
	cartId: string,
	details: CheckoutDetails,
	now = new Date()
): Promise<boolean> {
	return transact(async (tx) => {
		if (!(await lockCart(tx, cartId))) return false;
		const row = { ...details, savedAt: now };
		await tx
			.insert(checkoutDetails)
			.values({ cartId, ...row })
			.onDuplicateKeyUpdate({ set: row });
		await tx.update(carts).set({ updatedAt: now }).where(eq(carts.id, cartId));
		return true;
	});
}

/** The details last sent from this basket, or null. */
export async function checkoutDetailsFor(
	cartId: string | null,
	conn: Db | Tx = db
): Promise<CheckoutDetails | null> {
	if (!cartId) return null;
	const [row] = await conn
		.select({
			name: checkoutDetails.name,
			email: checkoutDetails.email,
			address: checkoutDetails.address,
			giftNote: checkoutDetails.giftNote
		})
		.from(checkoutDetails)
		.where(eq(checkoutDetails.cartId, cartId));
	return row ?? null;
}

/** Forgets the basket's details (its order is paid: they live on in the order itself). */
export async function forgetCheckoutDetails(tx: Tx, cartId: string) {
	await tx.delete(checkoutDetails).where(eq(checkoutDetails.cartId, cartId));
}

/** Deletes details saved longer ago than a basket cookie lives; returns how many. */
export async function forgetStaleCheckoutDetails(now = new Date()): Promise<number> {
	const [res] = await db
		.delete(checkoutDetails)
		.where(lt(checkoutDetails.savedAt, new Date(now.getTime() - BASKET_LIFETIME_MS)));
	return res.affectedRows;
}

/** Once an hour across all app processes. */
export function startCheckoutDetailsSweeper() {
	startOncePerInterval('checkout-details-sweep', 60 * 60 * 1000, () =>
		forgetStaleCheckoutDetails()
	);
}
