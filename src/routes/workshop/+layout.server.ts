import { requireRole } from '$lib/server/auth/guard';
import type { LayoutServerLoad } from './$types';

/** The shell needs the name and role; each page below checks again where it reads data. */
export const load: LayoutServerLoad = (event) => {
	const user = requireRole(event, 'owner', 'helper');
	return { user };
};
