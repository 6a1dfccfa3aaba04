import { apiError, requireRole } from '$lib/server/auth/guard';
import { parseQuery, slipResponse } from '$lib/server/pdf/slip-response';
import { orderRef, slipQuery } from '$lib/schemas/slips';
import type { RequestHandler } from './$types';

/** The packing slip for one order: ?paper=a4|letter|label. Owner and helpers print slips. */
export const GET: RequestHandler = async (event) => {
	requireRole(event, 'owner', 'helper');
	const q = parseQuery(event.url, slipQuery.omit({ kind: true }));
	if (q.response) return q.response;
	const ref = orderRef.safeParse(event.params.ref);
	if (!ref.success) return apiError(404, 'No such order.');
	return slipResponse([ref.data], q.data.paper, 'packing');
};
