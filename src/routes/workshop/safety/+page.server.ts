import { requireRole } from '$lib/server/auth/guard';
import type { PageServerLoad } from './$types';

/** The workshop's own safety notes: for the carver and helpers, not for buyers. */
export const load: PageServerLoad = (event) => {
	requireRole(event, 'owner', 'helper');
	return {};
};
