import { requireRole } from '$lib/server/auth/guard';
import { parseQuery, slipResponse } from '$lib/server/pdf/slip-response';
import { slipBatchQuery } from '$lib/orders/slips-schema';
import type { RequestHandler } from './$types';

/** Several orders' slips in one PDF: ?refs=A,B,C&paper=a4|letter|label&kind=packing|gift. */
export const GET: RequestHandler = async (event) => {
	requireRole(event, 'owner', 'helper');
	const q = parseQuery(event.url, slipBatchQuery);
	if (q.response) return q.response;
	return slipResponse(q.data.refs, q.data.paper, q.data.kind);
};
