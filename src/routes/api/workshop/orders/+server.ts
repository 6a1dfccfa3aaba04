import { json } from '@sveltejs/kit';
import { requireRoleApi } from '$lib/server/auth/guard';
import { workshopOrders } from '$lib/server/orders/views';
import type { RequestHandler } from './$types';

/** The workshop's order list as JSON, newest first. */
export const GET: RequestHandler = async (event) => {
	requireRoleApi(event, 'owner', 'helper');
	const orders = await workshopOrders();
	return json({ orders: orders.map((o) => ({ ...o, createdAt: o.createdAt.toISOString() })) });
};
