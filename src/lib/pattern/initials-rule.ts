/**
 * A personalised line needs initials: an empty box is not "no initials", it is a buyer who has
 * not typed them yet. Shared by the piece page (browser) and its form action (server).
 */
export const INITIALS_NEEDED = 'Type one to three letters for the rosette.';

/** The message when a personalised line has no letters yet, or null when it has some. */
export function initialsMissing(mode: string, initials: string | undefined): string | null {
	return mode === 'personalised' && !(initials ?? '').trim() ? INITIALS_NEEDED : null;
}
