import { requireRole } from '$lib/server/auth/guard';
import { ordersCsv } from '$lib/server/orders/export';
import { tableStateFromUrl } from '$lib/orders/workshop-orders-schema';
import type { RequestHandler } from './$types';

/** The table's filters from the same query string; a bad one falls back as the page does. */
export const GET: RequestHandler = async (event) => {
	requireRole(event, 'owner', 'helper');
	const q = tableStateFromUrl(event.url.searchParams);
	return new Response(await ordersCsv(q), {
		headers: {
			'content-type': 'text/csv; charset=utf-8; header=present',
			'content-disposition': 'attachment; filename="orders.csv"',
			'cache-control': 'private, no-store'
		}
	});
};
