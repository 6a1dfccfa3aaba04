import { cartCount, cartIdFrom } from '$lib/server/cart';
import type { LayoutServerLoad } from './$types';

export const load: LayoutServerLoad = async ({ locals, cookies, depends }) => {
	depends('app:cart');
	return { user: locals.user, cartCount: await cartCount(cartIdFrom(cookies)) };
};
