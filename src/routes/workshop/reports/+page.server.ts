import { requireRole } from '$lib/server/auth/guard';
import { moneyReport } from '$lib/server/booth/money-report';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'owner');
	return { report: await moneyReport() };
};
