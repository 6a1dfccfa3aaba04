/**
 * What the buyer's personaliser draws: the carving close up and the whole piece, with the figures
 * in its caption. One function for both sides: the server draws the first picture into the page
 * (so it shows before any script runs, and without JavaScript at all), and the browser loads this
 * module — the engine and the letter outlines, the largest part of the piece page's script — only
 * after the page is up, then redraws on every keystroke without asking the server.
 */
import { computePattern } from './index';
import { letterFont } from './letter-font';
import { ROSETTE_STYLES, type RosetteStyle } from './styles';
import { snapshotInput, styledLayout, type PiecePattern } from './snapshot';
import { waysOut, type LargerPiece, type WaysOut } from './ways-out';

export type PreviewInput = {
	pattern: PiecePattern;
	widthMm: number;
	lengthMm: number;
	thicknessMm?: number;
	curvedTop?: boolean;
	/** As typed; reduced here to at most three capitals A–Z (the server checks what is posted). */
	initials: string;
	wood?: string;
	style: RosetteStyle;
	idPrefix: string;
	/** The piece's woods and the server's larger pieces, for the ways out of a refusal. */
	woods?: string[];
	larger?: LargerPiece[];
};

export type Preview = {
	svg: string;
	wholeSvg: string;
	chipCount: number;
	letterCount: number;
	estimateMinutes: number;
	warnings: { code: string; message: string }[];
	/** Set when the initials are too small to carve in this wood: the refusal and ways out. */
	refusal: WaysOut | null;
};

export function drawPreview(p: PreviewInput): Preview {
	const initials = p.initials
		.toUpperCase()
		.replace(/[^A-Z]/g, '')
		.slice(0, 3);
	const style = ROSETTE_STYLES[p.style] ? p.style : 'classic';
	const input = snapshotInput(
		styledLayout(p.pattern, style, initials),
		{
			widthMm: p.widthMm,
			lengthMm: p.lengthMm,
			thicknessMm: p.thicknessMm,
			curvedTop: p.curvedTop
		},
		p.wood
	);
	const font = letterFont();
	// The carving close up, large; the whole piece small beside it.
	const close = computePattern(input, { font, idPrefix: p.idPrefix, closeUpMm: 6 });
	const whole = computePattern(input, { font, idPrefix: `${p.idPrefix}w` });
	return {
		svg: close.svg,
		wholeSvg: whole.svg,
		chipCount: close.chipCount,
		letterCount: close.letterCount,
		estimateMinutes: close.estimateMinutes,
		// The letters' size is the refusal below, not a warning beside it.
		warnings: close.warnings
			.filter((w) => w.code !== 'letters-small' && w.code !== 'strokes-thin')
			.map((w) => ({ code: w.code, message: w.message })),
		refusal: waysOut({
			initials,
			diameterMm: p.pattern.diameterMm,
			style,
			wood: input.woodSlug ?? '',
			woods: p.woods ?? [],
			larger: p.larger,
			font
		})
	};
}
