import { requireRole } from '$lib/server/auth/guard';
import { fairPieces, getFair } from '$lib/server/fairs/fairs';
import { checklistPdf } from '$lib/server/fairs/checklist-pdf';
import { fairIdParam } from '$lib/server/fairs/fair-id';
import { orPageError } from '$lib/server/errors/page-answer';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async (event) => {
	requireRole(event, 'owner', 'helper');
	const id = fairIdParam(event.params.id);
	const fair = await orPageError(() => getFair(id));
	const paper = event.url.searchParams.get('paper') === 'letter' ? 'letter' : 'a4';
	const lines = (await fairPieces(id)).map((p) => ({
		title: p.title,
		woodName: p.woodName,
		quantity: p.loadedOut
	}));
	const bytes = await checklistPdf(fair, lines, paper);
	return new Response(bytes as unknown as BodyInit, {
		headers: {
			'content-type': 'application/pdf',
			'content-disposition': `inline; filename="load-out-${id}-${paper}.pdf"`
		}
	});
};
