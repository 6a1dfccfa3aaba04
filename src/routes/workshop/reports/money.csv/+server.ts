import { requireRole } from '$lib/server/auth/guard';
import { moneyCsv, moneyReport } from '$lib/server/booth/money-report';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async (event) => {
	requireRole(event, 'owner');
	return new Response(moneyCsv(await moneyReport()), {
		headers: {
			'content-type': 'text/csv; charset=utf-8; header=present',
			'content-disposition': 'attachment; filename="chipstall-money.csv"'
		}
	});
};
