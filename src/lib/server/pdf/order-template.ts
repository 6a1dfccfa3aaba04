/**
 * The 1:1 template for one personalised order line: the stored snapshot is recomputed on the
 * server (never trusted as drawn) and printed with the order reference.
 */
import { computePattern } from '$lib/pattern';
import type { GlyphSource } from '$lib/pattern/lettering';
import { letterFont } from '$lib/pattern/letter-font';
import { snapshotInput, type PieceBlank, type Personalisation } from '$lib/pattern/snapshot';
import { templatePdf, type Paper } from './template';

export type OrderLineTemplateInput = {
	/** The personalisation snapshot kept with the order line. */
	personalisation: Personalisation;
	/** The piece's blank. */
	blank: PieceBlank;
	woodSlug: string;
	orderRef: string;
	lineTitle: string;
	paper?: Paper;
	font?: GlyphSource;
};

export async function orderLineTemplatePdf(input: OrderLineTemplateInput): Promise<Uint8Array> {
	const result = computePattern(snapshotInput(input.personalisation, input.blank, input.woodSlug), {
		font: input.font ?? letterFont(),
		svg: false
	});
	return templatePdf(result, {
		paper: input.paper ?? 'a4',
		orderRef: input.orderRef,
		title: input.lineTitle
	});
}
