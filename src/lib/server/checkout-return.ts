import { expireCheckoutSession, lastPaymentError } from './checkout';
import { orderByRef, releaseOrder } from './orders';

/**
 * The buyer came back from the payment page without paying (cancelled, or gave up after a
 * decline). Close the session, put held pieces back, and say what happened. Only an order made
 * from this same cart is touched.
 */
export async function returnUnpaid(ref: string | null, cartId: string | null) {
	if (!ref || !cartId) return { declined: null as string | null };
	const order = await orderByRef(ref);
	if (!order || order.cartId !== cartId) return { declined: null };
	let declined: string | null = null;
	if (order.status === 'pending') {
		if (order.checkoutSessionId) {
			declined = await lastPaymentError(order.checkoutSessionId);
			await expireCheckoutSession(order.checkoutSessionId);
		}
		await releaseOrder(order.id);
	}
	return { declined, status: order.status };
}
