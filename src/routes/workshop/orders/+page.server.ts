import { requireRole } from '$lib/server/auth/guard';
import { workshopOrders } from '$lib/server/orders/views';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'owner', 'helper');
	return { orders: await workshopOrders() };
};
