import { requireRole } from '$lib/server/auth/guard';
import { listAllPieces } from '$lib/server/catalogue/pieces-admin';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'owner');
	return { pieces: await listAllPieces() };
};
