import { eq } from 'drizzle-orm';
import type { Tx } from '../db';
import { carts } from '../db/schema';

/**
 * Locks the basket's row for the rest of the transaction, so one checkout of a basket runs at a
 * time; false when there is no such basket.
 */
export async function lockCart(tx: Tx, cartId: string): Promise<boolean> {
	const [cart] = await tx
		.select({ id: carts.id })
		.from(carts)
		.where(eq(carts.id, cartId))
		.for('update');
	return Boolean(cart);
}
