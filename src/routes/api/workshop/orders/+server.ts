import { json } from '@sveltejs/kit';
import { apiError, requireRoleApi } from '$lib/server/auth/guard';
import { listWorkshopOrders } from '$lib/server/orders/table';
import { parseOrderTableQuery } from '$lib/schemas/workshop-orders';
import { fieldErrors } from '$lib/schemas/cart';
import type { RequestHandler } from './$types';

/** One page of the workshop's order table: `?sort&dir&status&from&to&personalised&q&page&size`. */
export const GET: RequestHandler = async (event) => {
	requireRoleApi(event, 'owner', 'helper');
	const parsed = parseOrderTableQuery(event.url.searchParams);
	if (!parsed.success) {
		return apiError(400, 'Check the table filters.', fieldErrors(parsed.error));
	}
	return json({ query: parsed.data, ...(await listWorkshopOrders(parsed.data)) });
};
