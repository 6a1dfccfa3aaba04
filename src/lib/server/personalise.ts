import { computePattern } from '$lib/pattern';
import type { Personalisation, PiecePattern } from './db/schema';
import { jsonValue } from './json-column';

type PieceBlank = { pattern: unknown; widthMm: number; lengthMm: number; thicknessMm: number };
type WoodTones = { slug?: string; toneLight: string; toneDark: string };

export const STYLES = { classic: 'Classic six petals', split: 'Split petals (24 chips)' } as const;
export type Style = keyof typeof STYLES;

const INITIALS = /^[A-Z]{1,3}$/;

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
	const initials = input.initials.trim().toUpperCase();
	if (!INITIALS.test(initials)) {
		return { ok: false, fields: { initials: ['Use one to three letters, A to Z.'] } };
	}
	const style = (input.style || 'classic') as Style;
	if (!(style in STYLES)) return { ok: false, fields: { style: ['Choose one of the rosette styles.'] } };
	const layout = jsonValue<PiecePattern>(piece.pattern);
	const spacingMm = layout.spacingMm || layout.diameterMm / 2;
	const result = computePattern(
		{
			diameterMm: layout.diameterMm,
			count: layout.count,
			spacingMm,
			split: style === 'split',
			initials,
			woodSlug: wood.slug,
			widthMm: piece.widthMm,
			lengthMm: piece.lengthMm,
			thicknessMm: piece.thicknessMm
		},
		{ svg: false }
	);
	return {
		ok: true,
		snapshot: {
			initials,
			style,
			diameterMm: layout.diameterMm,
			count: layout.count,
			spacingMm,
			split: style === 'split',
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
		{ idPrefix }
	).svg;
}
