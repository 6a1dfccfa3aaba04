import { json } from '@sveltejs/kit';
import { requireRoleApi } from '$lib/server/auth/guard';
import { apiInvalid } from '$lib/server/http/api-errors';
import { listWorkshopOrders } from '$lib/server/orders/table';
import { parseOrderTableQuery } from '$lib/orders/workshop-orders-schema';
import type { RequestHandler } from './$types';

/** One page of the workshop's order table: `?sort&dir&status&from&to&personalised&q&page&size`. */
export const GET: RequestHandler = async (event) => {
	requireRoleApi(event, 'owner', 'helper');
	const parsed = parseOrderTableQuery(event.url.searchParams);
	if (!parsed.success) return apiInvalid(parsed.error, 'Check the table filters.');
	return json({ query: parsed.data, ...(await listWorkshopOrders(parsed.data)) });
};
