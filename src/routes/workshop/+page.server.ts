import { requireRole } from '$lib/server/auth/guard';
import { todaySummary } from '$lib/server/workshop-today';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'owner', 'helper');
	return { name: user.name, role: user.role, summary: await todaySummary() };
};
