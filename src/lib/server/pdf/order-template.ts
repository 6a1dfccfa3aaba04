/**
 * The 1:1 template for one personalised order line: the stored snapshot is recomputed on the
 * server (never trusted as drawn) and printed with the order reference.
 */
import { computePattern } from '$lib/pattern';
import type { GlyphSource } from '$lib/pattern/lettering';
import { letterFont } from '$lib/pattern/letter-font';
import { templatePdf, type Paper } from './template';

export type OrderLineTemplateInput = {
	/** The personalisation snapshot kept with the order line. */
	personalisation: {
		initials: string;
		diameterMm: number;
		count: number;
		spacingMm?: number;
		split: boolean;
	};
	/** The piece's blank. */
	blank: { widthMm: number; lengthMm: number; thicknessMm?: number; curvedTop?: boolean };
	woodSlug: string;
	orderRef: string;
	lineTitle: string;
	paper?: Paper;
	font?: GlyphSource;
};

export async function orderLineTemplatePdf(input: OrderLineTemplateInput): Promise<Uint8Array> {
	const p = input.personalisation;
	const result = computePattern(
		{
			diameterMm: p.diameterMm,
			count: p.count,
			spacingMm: p.spacingMm,
			split: p.split,
			initials: p.initials,
			woodSlug: input.woodSlug,
			widthMm: input.blank.widthMm,
			lengthMm: input.blank.lengthMm,
			thicknessMm: input.blank.thicknessMm,
			curvedTop: input.blank.curvedTop
		},
		{ font: input.font ?? letterFont(), svg: false }
	);
	return templatePdf(result, {
		paper: input.paper ?? 'a4',
		orderRef: input.orderRef,
		title: input.lineTitle
	});
}
