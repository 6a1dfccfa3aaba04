import { requireRole } from '$lib/server/auth/guard';
import { fairReport, fairsCompared } from '$lib/server/booth/fair-report';
import { fairIdParam } from '$lib/server/fairs/fair-id';
import { orPageError } from '$lib/server/errors/page-answer';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'owner');
	const id = fairIdParam(event.params.id);
	const r = await orPageError(() => fairReport(id));
	return {
		fair: {
			id: r.fair.id,
			name: r.fair.name,
			place: r.fair.place,
			startsOn: r.fair.startsOn,
			currency: r.fair.currency,
			closed: Boolean(r.fair.closedAt)
		},
		result: { ...r.result, stock: r.result.stock.filter((s) => s.verdict !== 'ok') },
		byMethod: r.byMethod,
		byPiece: r.byPiece,
		byHour: r.byHour,
		netPerHourMinor: r.netPerHourMinor,
		lateSales: r.lateSales,
		corrections: r.corrections,
		compared: await fairsCompared()
	};
};
