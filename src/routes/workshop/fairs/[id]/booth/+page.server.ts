import { requireRole } from '$lib/server/auth/guard';
import { boothView } from '$lib/server/booth/view';
import { fairIdParam } from '$lib/server/fairs/fair-id';
import { orPageError } from '$lib/server/errors/page-answer';
import { assertFairAccess } from '$lib/server/fairs/fair-helpers';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'owner', 'helper');
	const id = fairIdParam(event.params.id);
	await orPageError(() => assertFairAccess(user, id));
	return orPageError(() => boothView(id, user.role === 'owner'));
};
