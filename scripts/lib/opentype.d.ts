/**
 * The small part of opentype.js (v2 ships no types) that the letter generator and its check use.
 * The app itself never imports the library: it draws from the generated letter data.
 */
declare module 'opentype.js' {
	import type { PathCommand } from '$lib/pattern/lettering';
	export type Path = {
		commands: PathCommand[];
		getBoundingBox(): { x1: number; y1: number; x2: number; y2: number };
	};
	export type Glyph = {
		index: number;
		advanceWidth: number;
		getPath(x: number, y: number, fontSize: number): Path;
	};
	export type Font = {
		unitsPerEm: number;
		tables: { os2?: { sCapHeight?: number } };
		charToGlyph(char: string): Glyph;
		getKerningValue(left: Glyph, right: Glyph): number;
	};
	export function parse(buffer: ArrayBuffer): Font;
	const opentype: { parse: typeof parse };
	export default opentype;
}
