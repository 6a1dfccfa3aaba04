import { requireRole } from '$lib/server/auth/guard';
import { fairCsv, fairReport } from '$lib/server/booth/fair-report';
import { fairIdParam } from '$lib/server/fairs/fair-id';
import { orPageError } from '$lib/server/errors/page-answer';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async (event) => {
	requireRole(event, 'owner');
	const id = fairIdParam(event.params.id);
	const r = await orPageError(() => fairReport(id));
	return new Response(fairCsv(r), {
		headers: {
			'content-type': 'text/csv; charset=utf-8; header=present',
			'content-disposition': `attachment; filename="fair-${id}-sales.csv"`
		}
	});
};
