/** The letter font read straight from the file, for scripts and tests run outside Vite. */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { parseLetterFont } from '../fonts/parse';
import type { GlyphSource } from '../pattern/lettering';

export const LETTER_FONT_PATH = fileURLToPath(
	new URL('../pattern/fonts/nunito-latin-800-normal.woff', import.meta.url)
);

export function readLetterFont(path = LETTER_FONT_PATH): GlyphSource {
	return parseLetterFont(readFileSync(path));
}
