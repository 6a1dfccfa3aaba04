import { addressLines, getShopInfo } from '$lib/server/settings/shop-settings';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async () => {
	const shop = await getShopInfo();
	return { name: shop.name, email: shop.email, address: addressLines(shop.address) };
};
