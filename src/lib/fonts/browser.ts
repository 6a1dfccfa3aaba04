/**
 * The letter font in the browser: the .woff ships as a bundled asset and is fetched once,
 * from our own origin.
 */
import fontUrl from '../pattern/fonts/nunito-latin-800-normal.woff?url';
import type { GlyphSource } from '../pattern/lettering';
import { parseLetterFont } from './parse';

let pending: Promise<GlyphSource> | null = null;

export function loadLetterFont(): Promise<GlyphSource> {
	pending ??= fetch(fontUrl)
		.then((res) => {
			if (!res.ok) throw new Error(`Letter font: ${res.status}`);
			return res.arrayBuffer();
		})
		.then(parseLetterFont)
		.catch((err) => {
			pending = null; // let a later call try again
			throw err;
		});
	return pending;
}
