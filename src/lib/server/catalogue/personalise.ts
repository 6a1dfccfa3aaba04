import { computePattern } from '$lib/pattern';
import { initialsSchema, styleSchema } from '$lib/pattern/pattern-schema';
import {
	snapshotInput,
	snapshotOf,
	styledLayout,
	type Personalisation,
	type PiecePattern
} from '$lib/pattern/snapshot';
import { letterFont } from '$lib/pattern/letter-font';
import { letterFit, refusalText } from '$lib/pattern/cuttable';

type PieceBlank = { pattern: PiecePattern; widthMm: number; lengthMm: number; thicknessMm: number };
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
):
	| { ok: true; snapshot: Personalisation }
	| { ok: false; fields: Record<string, string[]>; message?: string } {
	const parsedInitials = initialsSchema.safeParse(input.initials);
	if (!parsedInitials.success) {
		return { ok: false, fields: { initials: [parsedInitials.error.issues[0].message] } };
	}
	const parsedStyle = styleSchema.safeParse(input.style || 'classic');
	if (!parsedStyle.success)
		return { ok: false, fields: { style: [parsedStyle.error.issues[0].message] } };
	const style = parsedStyle.data;
	const layout = styledLayout(piece.pattern, style, parsedInitials.data);
	// Letters below the wood's minimum are refused, by the same check the personaliser makes.
	const fit = letterFit(
		layout.initials,
		layout.diameterMm,
		wood.slug,
		letterFont(),
		layout.medallionRatio
	);
	if (!fit.ok) {
		const message = refusalText(fit);
		return { ok: false, fields: { initials: [message] }, message };
	}
	const result = computePattern(snapshotInput(layout, piece, wood.slug), {
		svg: false,
		font: letterFont()
	});
	return { ok: true, snapshot: snapshotOf(layout, style, result) };
}

/** The preview drawing for a stored snapshot, in the chosen wood. */
export function previewSvg(
	snap: Personalisation,
	wood: WoodTones,
	blank: { widthMm: number; lengthMm: number; thicknessMm: number },
	idPrefix = 'pv'
): string {
	return computePattern(snapshotInput(snap, blank, wood.slug), {
		idPrefix,
		font: letterFont()
	}).svg;
}

/**
 * Why a stored snapshot can no longer be sold (its letters under the wood's minimum), or null.
 * Lines put in a basket before the check, or in a wood the buyer changed since, meet it here.
 */
export function snapshotRefusal(snap: Personalisation, woodSlug: string): string | null {
	const fit = letterFit(
		snap.initials,
		snap.diameterMm,
		woodSlug,
		letterFont(),
		snap.medallionRatio
	);
	return fit.ok ? null : refusalText(fit);
}
