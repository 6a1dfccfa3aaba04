import { addressLines, awayNotice, getAway, getShopInfo } from '$lib/server/settings/shop-settings';
import type { LayoutServerLoad } from './$types';

/**
 * Shop-wide only: nothing here depends on the visitor, so the public pages under this layout can
 * be cached and served to anyone. The basket count and the signed-in name come from /api/me in
 * the browser (cart-count.svelte.ts).
 */
export const load: LayoutServerLoad = async () => {
	const [shop, away] = await Promise.all([getShopInfo(), getAway()]);
	return {
		shop: { name: shop.name, email: shop.email, address: addressLines(shop.address) },
		away: awayNotice(away)
	};
};
