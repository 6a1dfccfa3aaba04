import { getPolicies, getShopInfo } from '$lib/server/settings/shop-settings';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async () => {
	const [shop, policies] = await Promise.all([getShopInfo(), getPolicies()]);
	return { name: shop.name, email: shop.email, ...policies };
};
