import { cartIdFrom, cartCount } from '$lib/server/cart';
import { orderBySession } from '$lib/server/orders';
import { buyerOrderView } from '$lib/server/order-view';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ url, cookies, depends }) => {
	depends('app:order');
	const sessionId = url.searchParams.get('session_id') ?? '';
	const order = /^[A-Za-z0-9_]{4,255}$/.test(sessionId) ? await orderBySession(sessionId) : null;
	if (!order) return { order: null, cartCount: await cartCount(cartIdFrom(cookies)) };
	return { order: await buyerOrderView(order) };
};
