/**
 * The letter font on the server. The .woff is inlined into the server bundle at build time
 * (so the built app needs no path to the source tree) and parsed once per process.
 */
import fontData from '$lib/pattern/fonts/nunito-latin-800-normal.woff?inline';
import { parseLetterFont } from '$lib/fonts/parse';
import type { GlyphSource } from '$lib/pattern/lettering';

let font: GlyphSource | null = null;

export function letterFont(): GlyphSource {
	if (!font) {
		const base64 = fontData.slice(fontData.indexOf(',') + 1);
		font = parseLetterFont(Buffer.from(base64, 'base64'));
	}
	return font;
}
