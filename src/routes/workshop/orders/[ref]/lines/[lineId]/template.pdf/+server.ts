import { z } from 'zod';
import { requireRole } from '$lib/server/auth/guard';
import { apiError } from '$lib/server/http/api-errors';
import { letterFont } from '$lib/pattern/letter-font';
import { orderLineForTemplate } from '$lib/server/orders/views';
import { orderLineTemplatePdf } from '$lib/server/pdf/order-template';
import type { RequestHandler } from './$types';

const paperSchema = z
	.enum(['a4', 'letter'], { error: 'Paper must be a4 or letter.' })
	.default('a4');

/** The 1:1 carving template for one personalised order line, with the order reference on it. */
export const GET: RequestHandler = async (event) => {
	requireRole(event, 'owner', 'helper');
	const paper = paperSchema.safeParse(event.url.searchParams.get('paper') ?? undefined);
	if (!paper.success) {
		return apiError(400, 'This paper size is not offered.', {
			paper: [paper.error.issues[0].message]
		});
	}
	const lineId = /^[1-9]\d{0,9}$/.test(event.params.lineId) ? Number(event.params.lineId) : null;
	const line = lineId ? await orderLineForTemplate(event.params.ref, lineId) : null;
	if (!line) return apiError(404, 'No such line on this order.');
	if (!line.personalisation)
		return apiError(404, 'This line is not personalised, so it has no template.');

	const bytes = await orderLineTemplatePdf({
		personalisation: line.personalisation,
		blank: { widthMm: line.widthMm, lengthMm: line.lengthMm, thicknessMm: line.thicknessMm },
		woodSlug: line.woodSlug,
		orderRef: line.ref,
		lineTitle: `${line.title}, ${line.woodName}`,
		paper: paper.data,
		font: letterFont()
	});
	const name = `template-${line.ref}-line${line.id}-${paper.data}.pdf`;
	return new Response(bytes as BodyInit, {
		headers: {
			'content-type': 'application/pdf',
			'content-disposition': `attachment; filename="${name}"`,
			'cache-control': 'private, no-store'
		}
	});
};
