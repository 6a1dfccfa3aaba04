import { requireRole } from '$lib/server/auth/guard';
import { oneOrderSlip } from '$lib/server/pdf/slip-response';
import type { RequestHandler } from './$types';

/** The gift slip for one order: ?paper=a4|letter|label. Owner and helpers print slips. */
export const GET: RequestHandler = (event) => {
	requireRole(event, 'owner', 'helper');
	return oneOrderSlip(event.url, event.params.ref, 'gift');
};
