/**
 * Turns a parsed font (an opentype.js Font, or anything shaped like one) into the GlyphSource
 * the lettering needs. Pure: parsing the bytes happens in the loaders, not here.
 */
import type { GlyphSource, PathCommand } from './lettering';

type GlyphLike = {
	advanceWidth?: number;
	getPath(x: number, y: number, fontSize: number): { commands: unknown[] };
};
export type FontLike = {
	unitsPerEm: number;
	tables: { os2?: { sCapHeight?: number } };
	charToGlyph(char: string): GlyphLike;
	getKerningValue?(left: GlyphLike, right: GlyphLike): number;
};

export function glyphSourceFromFont(font: FontLike): GlyphSource {
	const em = font.unitsPerEm;
	const cache = new Map<string, { commands: PathCommand[] }[]>();
	return {
		unitsPerEm: em,
		// Nunito's OS/2 table carries the cap height; 70 % of the em is a fair guess otherwise.
		capHeight: font.tables.os2?.sCapHeight || em * 0.7,
		outline(text) {
			const hit = cache.get(text);
			if (hit) return hit;
			// One glyph per capital; full text shaping is not needed for initials.
			const glyphs = Array.from(text).map((ch) => font.charToGlyph(ch));
			let pen = 0;
			const out = glyphs.map((g, i) => {
				const commands = g.getPath(pen, 0, em).commands as PathCommand[];
				pen += g.advanceWidth ?? em * 0.6;
				const next = glyphs[i + 1];
				if (next && font.getKerningValue) pen += font.getKerningValue(g, next);
				return { commands };
			});
			if (cache.size > 200) cache.clear();
			cache.set(text, out);
			return out;
		}
	};
}
