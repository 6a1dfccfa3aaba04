/**
 * The capitals the initials are drawn in, as one GlyphSource for every caller: the browser
 * preview, the server's cart and API, the PDF, the bench and the tests. The outlines are plain
 * data generated from the shipped font file (fonts/letters.generated.ts), so nothing parses a
 * font at run time and no font library reaches the browser.
 */
import type { GlyphSource, PathCommand } from './lettering';
import { LETTERS } from './fonts/letters.generated';
import type { LetterFontData } from './letter-font-data';

const ARGS = { M: 2, L: 2, Q: 4, C: 6, Z: 0 } as const;

/** One path string back into commands (only the explicit form the generator writes). */
export function parsePath(path: string): PathCommand[] {
	const out: PathCommand[] = [];
	for (const [, type, rest] of path.matchAll(/([MLQCZ])([^MLQCZ]*)/g)) {
		const n = rest.trim() ? rest.trim().split(/\s+/).map(Number) : [];
		const t = type as keyof typeof ARGS;
		if (n.length !== ARGS[t] || n.some((v) => !Number.isFinite(v)))
			throw new Error(`Letter path: bad ${t} command "${type}${rest}"`);
		if (t === 'M' || t === 'L') out.push({ type: t, x: n[0], y: n[1] });
		else if (t === 'Q') out.push({ type: t, x1: n[0], y1: n[1], x: n[2], y: n[3] });
		else if (t === 'C')
			out.push({ type: t, x1: n[0], y1: n[1], x2: n[2], y2: n[3], x: n[4], y: n[5] });
		else out.push({ type: 'Z' });
	}
	return out;
}

function shifted(c: PathCommand, dx: number): PathCommand {
	switch (c.type) {
		case 'M':
		case 'L':
			return { ...c, x: c.x + dx };
		case 'Q':
			return { ...c, x1: c.x1 + dx, x: c.x + dx };
		case 'C':
			return { ...c, x1: c.x1 + dx, x2: c.x2 + dx, x: c.x + dx };
		default:
			return c;
	}
}

/**
 * A GlyphSource over generated letter data: one glyph per character, set on one line with the
 * font's kerning. Characters the data lacks (anything but A–Z) draw nothing and take 0.6 em, as
 * the initials are checked to be A–Z before they get here.
 */
export function glyphSourceFromData(data: LetterFontData): GlyphSource {
	const commands = new Map(Object.entries(data.glyphs).map(([ch, g]) => [ch, parsePath(g.path)]));
	return {
		unitsPerEm: data.unitsPerEm,
		capHeight: data.capHeight,
		outline(text) {
			const chars = Array.from(text);
			let pen = 0;
			return chars.map((ch, i) => {
				const out = { commands: (commands.get(ch) ?? []).map((c) => shifted(c, pen)) };
				pen += data.glyphs[ch]?.advance ?? data.unitsPerEm * 0.6;
				const next = chars[i + 1];
				if (next) pen += data.kerning[ch + next] ?? 0;
				return out;
			});
		}
	};
}

let font: GlyphSource | null = null;

/** The shipped letter font (Nunito ExtraBold capitals), built once from the generated data. */
export function letterFont(): GlyphSource {
	font ??= glyphSourceFromData(LETTERS);
	return font;
}
