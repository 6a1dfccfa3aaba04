/** The shape of the generated capitals (fonts/letters.generated.ts): plain data, no code. */
export type LetterGlyph = {
	/** Pen advance in font units. */
	advance: number;
	/** Outline bounds [xMin, yMin, xMax, yMax] in font units, y down (yMin is the top). */
	bounds: [number, number, number, number];
	/** SVG-style path, absolute commands M L Q C Z, font units, y down, baseline y = 0, pen at x = 0. */
	path: string;
};

export type LetterFontData = {
	unitsPerEm: number;
	capHeight: number;
	glyphs: Record<string, LetterGlyph>;
	/** Kerning by letter pair ("AV"); pairs not listed kern by 0. */
	kerning: Record<string, number>;
};
