/**
 * What a buyer can do when their initials are too small to carve: each way out is offered only
 * when it makes the very same letters cuttable (letterFit in cuttable.ts decides, as the server
 * does). Pure; runs in the browser with the preview, and on the server for a refused post.
 */
import { letterFit, refusalText, type LetterFit } from './cuttable';
import { ROSETTE_STYLES, type RosetteStyle } from './styles';
import { LETTERING_DEFAULTS, type GlyphSource } from './lettering';

/** Another piece the server proposes: personalisable, with a larger rosette. */
export type LargerPiece = { slug: string; title: string; diameterMm: number; woods: string[] };

export type WaysOut = {
	fit: LetterFit;
	message: string;
	/** The first letters that fit, in the same piece, wood and style. */
	fewer: { initials: string; capHeightMm: number } | null;
	style: { style: RosetteStyle; label: string; capHeightMm: number } | null;
	wood: { slug: string; name: string; capHeightMm: number } | null;
	piece: { slug: string; title: string; diameterMm: number; capHeightMm: number } | null;
};

export function waysOut(p: {
	initials: string;
	diameterMm: number;
	style: RosetteStyle;
	wood: string;
	/** The woods this piece is offered in. */
	woods: string[];
	larger?: LargerPiece[];
	font: GlyphSource;
}): WaysOut | null {
	if (!p.initials) return null;
	const medallion = ROSETTE_STYLES[p.style].medallion;
	const fitOf = (initials: string, d: number, wood: string, ratio: number) =>
		letterFit(initials, d, wood, p.font, ratio);
	const fit = fitOf(p.initials, p.diameterMm, p.wood, medallion);
	if (fit.ok) return null;

	let fewer: WaysOut['fewer'] = null;
	for (let n = p.initials.length - 1; n >= 1 && !fewer; n--) {
		const f = fitOf(p.initials.slice(0, n), p.diameterMm, p.wood, medallion);
		if (f.ok) fewer = { initials: f.initials, capHeightMm: f.capHeightMm };
	}

	let style: WaysOut['style'] = null;
	for (const [key, s] of Object.entries(ROSETTE_STYLES)) {
		if (style || s.medallion <= medallion) continue;
		const f = fitOf(p.initials, p.diameterMm, p.wood, s.medallion);
		if (f.ok) style = { style: key as RosetteStyle, label: s.label, capHeightMm: f.capHeightMm };
	}

	let wood: WaysOut['wood'] = null;
	for (const slug of p.woods) {
		if (wood || slug === p.wood) continue;
		const f = fitOf(p.initials, p.diameterMm, slug, medallion);
		if (f.ok) wood = { slug, name: f.woodName, capHeightMm: f.capHeightMm };
	}

	// A larger piece in its usual style: the buyer's wood when it has it, else any of its woods.
	let piece: WaysOut['piece'] = null;
	for (const c of p.larger ?? []) {
		if (piece || c.diameterMm <= p.diameterMm) continue;
		const woods = c.woods.includes(p.wood) ? [p.wood] : c.woods;
		const f = woods
			.map((w) => fitOf(p.initials, c.diameterMm, w, LETTERING_DEFAULTS.medallionRatio))
			.find((x) => x.ok);
		if (f)
			piece = {
				slug: c.slug,
				title: c.title,
				diameterMm: c.diameterMm,
				capHeightMm: f.capHeightMm
			};
	}
	return { fit, message: refusalText(fit), fewer, style, wood, piece };
}
