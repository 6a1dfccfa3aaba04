import { cartCount, cartIdFrom } from '$lib/server/cart';
import { addressLines, awayNotice, getAway, getShopInfo } from '$lib/server/shop-settings';
import type { LayoutServerLoad } from './$types';

export const load: LayoutServerLoad = async ({ locals, cookies, depends }) => {
	depends('app:cart');
	const [count, shop, away] = await Promise.all([
		cartCount(cartIdFrom(cookies)),
		getShopInfo(),
		getAway()
	]);
	return {
		user: locals.user,
		cartCount: count,
		shop: { name: shop.name, email: shop.email, address: addressLines(shop.address) },
		away: awayNotice(away)
	};
};
