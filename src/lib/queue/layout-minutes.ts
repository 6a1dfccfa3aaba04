/**
 * The carving minutes of a piece's standard layout: its own rosettes with two initials (the usual
 * monogram, common practice), in the chosen wood. A personalisation that takes longer than this
 * may carry the owner's per-minute surcharge. Pure: the personaliser and the server both use it.
 */
import { computePattern } from '$lib/pattern';
import { letterFont } from '$lib/pattern/letter-font';
import { snapshotInput, type PieceBlank, type PiecePattern } from '$lib/pattern/snapshot';

export const STANDARD_INITIALS = 'AB';

export function standardMinutes(layout: PiecePattern, blank: PieceBlank, woodSlug: string): number {
	const r = computePattern(
		snapshotInput({ ...layout, initials: STANDARD_INITIALS }, blank, woodSlug),
		{ svg: false, font: letterFont() }
	);
	return Math.round(r.estimateMinutes);
}
