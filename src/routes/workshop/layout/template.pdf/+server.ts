import { requireRole } from '$lib/server/auth/guard';
import { computePattern } from '$lib/pattern';
import { patternFieldErrors, patternInputFrom, plannerSchema } from '$lib/pattern/pattern-schema';
import { letterFont } from '$lib/pattern/letter-font';
import { templatePdf } from '$lib/server/pdf/template';
import { json } from '@sveltejs/kit';
import type { RequestHandler } from './$types';

/** The planner's layout as a 1:1 PDF (owner only). */
export const GET: RequestHandler = async (event) => {
	requireRole(event, 'owner');
	const parsed = plannerSchema.safeParse(Object.fromEntries(event.url.searchParams));
	if (!parsed.success) {
		return json(
			{
				error: 'Some of the layout settings are not usable.',
				fields: patternFieldErrors(parsed.error)
			},
			{ status: 400 }
		);
	}
	const q = parsed.data;
	const result = computePattern(patternInputFrom(q), { font: letterFont(), svg: false });
	const bytes = await templatePdf(result, {
		paper: q.paper,
		title: `${q.count} × ${q.diameter} mm rosette`
	});
	const name = `layout-${q.count}x${q.diameter}mm-${q.paper}.pdf`;
	return new Response(bytes as BodyInit, {
		headers: {
			'content-type': 'application/pdf',
			'content-disposition': `attachment; filename="${name}"`,
			'cache-control': 'private, no-store'
		}
	});
};
