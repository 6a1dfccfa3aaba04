/**
 * The rosette styles a buyer can choose. Plain constants, apart from the schemas that check a
 * choice, so the browser's personaliser can list them without the validation library.
 * `medallion` is the plain centre that carries the initials, as a share of the rosette radius:
 * the open centre gives the letters about 1.6 times the room, for small rosettes.
 */
export const ROSETTE_STYLES = {
	classic: {
		split: false,
		medallion: 0.42,
		label: 'Classic',
		hint: 'Six petals, twelve chips a rosette'
	},
	split: {
		split: true,
		medallion: 0.42,
		label: 'Split petals',
		hint: 'Every chip halved: twenty-four smaller chips'
	},
	open: {
		split: false,
		medallion: 0.6,
		label: 'Open centre',
		hint: 'A wider plain centre: larger initials'
	}
} as const;
export type RosetteStyle = keyof typeof ROSETTE_STYLES;

export const isRosetteStyle = (s: unknown): s is RosetteStyle =>
	typeof s === 'string' && Object.hasOwn(ROSETTE_STYLES, s);

/** The style as words for a basket line, an e-mail or a slip: "open centre rosette". */
export function styleWords(style: string | null | undefined): string {
	const s = isRosetteStyle(style) ? style : 'classic';
	return `${ROSETTE_STYLES[s].label.toLowerCase()} rosette`;
}

/**
 * The style the personaliser starts on: a piece laid out with split petals opens on them, any
 * other on the classic rosette. A chosen style that is not one of ours falls back to it too.
 * The browser's personaliser and the server's first picture both start here, so they agree.
 */
export function startingStyle(pattern: { split?: boolean }, chosen?: unknown): RosetteStyle {
	if (isRosetteStyle(chosen)) return chosen;
	return pattern.split ? 'split' : 'classic';
}
