import { cartIdFrom, cartCount } from '$lib/server/cart';
import { buyerOrderView, orderBySession } from '$lib/server/orders/views';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ url, cookies, depends }) => {
	depends('app:order');
	const sessionId = url.searchParams.get('session_id') ?? '';
	const order = /^[A-Za-z0-9_]{4,255}$/.test(sessionId) ? await orderBySession(sessionId) : null;
	if (!order) return { order: null, cartCount: await cartCount(cartIdFrom(cookies)) };
	return { order: await buyerOrderView(order) };
};
