import { computePattern } from '$lib/pattern';
import { ROSETTE_STYLES } from '$lib/pattern/styles';
import { initialsSchema, styleSchema } from '$lib/schemas/pattern';
import type { Personalisation, PiecePattern } from './db/schema';
import { jsonValue } from './json-column';
import { letterFont } from '$lib/pattern/letter-font';

type PieceBlank = { pattern: unknown; widthMm: number; lengthMm: number; thicknessMm: number };
type WoodTones = { slug?: string; toneLight: string; toneDark: string };

/**
 * The server's own run of the pattern engine for a personalised piece: the piece's layout and
 * the buyer's initials and style in, a snapshot of the result out. Nothing the browser computed
 * is kept.
 */
export function personalise(
	piece: PieceBlank,
	wood: WoodTones,
	input: { initials: string; style?: string }
): { ok: true; snapshot: Personalisation } | { ok: false; fields: Record<string, string[]> } {
	const parsedInitials = initialsSchema.safeParse(input.initials);
	if (!parsedInitials.success) {
		return { ok: false, fields: { initials: [parsedInitials.error.issues[0].message] } };
	}
	const parsedStyle = styleSchema.safeParse(input.style || 'classic');
	if (!parsedStyle.success)
		return { ok: false, fields: { style: [parsedStyle.error.issues[0].message] } };
	const initials = parsedInitials.data;
	const style = parsedStyle.data;
	const split = ROSETTE_STYLES[style].split;
	const layout = jsonValue<PiecePattern>(piece.pattern);
	const spacingMm = layout.spacingMm || layout.diameterMm / 2;
	const result = computePattern(
		{
			diameterMm: layout.diameterMm,
			count: layout.count,
			spacingMm,
			split,
			initials,
			woodSlug: wood.slug,
			widthMm: piece.widthMm,
			lengthMm: piece.lengthMm,
			thicknessMm: piece.thicknessMm
		},
		{ svg: false, font: letterFont() }
	);
	return {
		ok: true,
		snapshot: {
			initials,
			style,
			diameterMm: layout.diameterMm,
			count: layout.count,
			spacingMm,
			split,
			chipCount: result.chipCount,
			cutLengthMm: Math.round(result.cutLengthMm),
			estimateMinutes: Math.round(result.estimateMinutes)
		}
	};
}

/** The preview drawing for a stored snapshot, in the chosen wood. */
export function previewSvg(
	snap: Personalisation,
	wood: WoodTones,
	blank: { widthMm: number; lengthMm: number; thicknessMm: number },
	idPrefix = 'pv'
): string {
	return computePattern(
		{
			diameterMm: snap.diameterMm,
			count: snap.count,
			spacingMm: snap.spacingMm,
			split: snap.split,
			initials: snap.initials,
			woodSlug: wood.slug,
			...blank
		},
		{ idPrefix, font: letterFont() }
	).svg;
}
