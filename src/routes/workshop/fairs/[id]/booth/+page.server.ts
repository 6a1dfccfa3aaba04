import { requireRole } from '$lib/server/auth/guard';
import { boothView } from '$lib/server/booth/view';
import { fairIdParam, orPageError } from '$lib/server/booth/http';
import { assertFairAccess } from '$lib/server/fairs/fair-helpers';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'owner', 'helper');
	const id = fairIdParam(event.params.id);
	await orPageError(() => assertFairAccess(user, id));
	return orPageError(() => boothView(id, user.role === 'owner'));
};
