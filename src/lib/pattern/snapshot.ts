/**
 * The one personalisation type and the one conversion from it (or a piece's default layout) to
 * the engine's input. The browser's personaliser, the server's pricing and order pages, the 1:1
 * template and the demo seed all go through here, so the rule "spacing 0 or missing means the
 * radius" lives in one place.
 */
import type { PatternInput, PatternResult } from './types';
import { ROSETTE_STYLES, type RosetteStyle } from './styles';

/** A piece's default rosette layout, as the catalogue stores it. */
export type PiecePattern = {
	diameterMm: number;
	count: number;
	/** Centre to centre; 0 or missing for single-rosette pieces, meaning "the radius". */
	spacingMm?: number;
	split?: boolean;
};

/** What an order line keeps of the buyer's choice, and the server's own figures for it. */
export type Personalisation = {
	initials: string;
	style: string;
	diameterMm: number;
	count: number;
	spacingMm: number;
	split: boolean;
	/** The style's medallion as a share of the radius; missing in older snapshots (0.42). */
	medallionRatio?: number;
	chipCount?: number;
	cutLengthMm?: number;
	estimateMinutes?: number;
};

export type PieceBlank = {
	widthMm: number;
	lengthMm: number;
	thicknessMm?: number;
	curvedTop?: boolean;
};

/** Rosette spacing: neighbouring rosettes overlap by the radius unless the layout says else. */
export function spacingOf(layout: { diameterMm: number; spacingMm?: number | null }): number {
	return layout.spacingMm || layout.diameterMm / 2;
}

/** Engine input for a stored snapshot, or for a piece's layout with the buyer's initials. */
export function snapshotInput(
	snap: PiecePattern & { initials?: string; medallionRatio?: number },
	blank: PieceBlank,
	woodSlug?: string
): PatternInput {
	return {
		diameterMm: snap.diameterMm,
		count: snap.count,
		spacingMm: spacingOf(snap),
		split: !!snap.split,
		initials: snap.initials,
		woodSlug,
		widthMm: blank.widthMm,
		lengthMm: blank.lengthMm,
		thicknessMm: blank.thicknessMm,
		curvedTop: blank.curvedTop,
		lettering: snap.medallionRatio ? { medallionRatio: snap.medallionRatio } : undefined
	};
}

/** The layout a buyer gets for a piece in a style: the piece's rosettes, the style's chips. */
export function styledLayout(layout: PiecePattern, style: RosetteStyle, initials: string) {
	return {
		diameterMm: layout.diameterMm,
		count: layout.count,
		spacingMm: spacingOf(layout),
		split: ROSETTE_STYLES[style].split,
		medallionRatio: ROSETTE_STYLES[style].medallion,
		initials
	};
}

/** The snapshot to store for a styled layout and the engine's result for it. */
export function snapshotOf(
	layout: ReturnType<typeof styledLayout>,
	style: RosetteStyle,
	result: Pick<PatternResult, 'chipCount' | 'cutLengthMm' | 'estimateMinutes'>
): Personalisation {
	return {
		...layout,
		style,
		chipCount: result.chipCount,
		cutLengthMm: Math.round(result.cutLengthMm),
		estimateMinutes: Math.round(result.estimateMinutes)
	};
}
