/**
 * How to look after a piece, written once and chosen by what the piece is: whether it is
 * finished for food (the piece's food-contact flag, which wins over its kind — a wall plate is
 * a plate but never sees food), and whether it hangs (ornaments). The piece page and the
 * order e-mail both take their words from here, so a display piece is never sent food advice.
 */

/** What care depends on: the piece's kind (see $lib/catalogue/kinds) and its food-contact flag. */
type CarePiece = { kind: string; foodContact: boolean };

export type CareKey = 'food' | 'hanging' | 'display';
export type Care = { key: CareKey; title: string; text: string };

const CARE: Record<CareKey, Omit<Care, 'key'>> = {
	food: {
		title: 'For food',
		text:
			'This piece is finished for food contact with a finish that is left to cure fully before ' +
			'it ships. Wash by hand in warm water, dry it standing, and wipe on food-grade mineral oil ' +
			'when it looks dry. Never put it in the dishwasher or leave it soaking.'
	},
	hanging: {
		title: 'For hanging',
		text:
			'A decorative ornament with a clear finish, not made for food or for small children to ' +
			'play with. Hang it away from candles, heaters and strong sun; between seasons store it ' +
			'wrapped in tissue somewhere dry.'
	},
	display: {
		title: 'For display',
		text:
			'A decorative piece with a clear finish, not made for food: do not serve food on it. Dust ' +
			'with a soft dry cloth; keep it out of strong sun and away from heaters, and never soak it.'
	}
};

/** Carved letters hold dust in their chips; said once for any piece carrying initials. */
export const LETTERS_CARE =
	'Your initials are cut as chips: a soft dry brush lifts the dust from them better than a cloth.';

export function careKey(piece: CarePiece): CareKey {
	if (piece.foodContact) return 'food';
	return piece.kind === 'ornament' ? 'hanging' : 'display';
}

export function careFor(piece: CarePiece): Care {
	const key = careKey(piece);
	return { key, ...CARE[key] };
}

/** The care notes for a set of pieces (one order): each kind of advice once, food first, with
 * the titles of the pieces it is for, so a mixed order says which advice goes with which piece. */
export function careForAll(items: (CarePiece & { title: string; personalised?: boolean })[]): {
	notes: (Care & { pieces: string[] })[];
	letters: boolean;
} {
	const order: CareKey[] = ['food', 'hanging', 'display'];
	return {
		notes: order
			.map((key) => ({
				key,
				...CARE[key],
				pieces: [...new Set(items.filter((i) => careKey(i) === key).map((i) => i.title))]
			}))
			.filter((n) => n.pieces.length > 0),
		letters: items.some((i) => i.personalised)
	};
}
