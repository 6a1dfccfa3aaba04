/**
 * The generated letter data (src/lib/pattern/fonts/letters.generated.ts) against the font file
 * itself. Outside reference: opentype.js 2.0.0, a general-purpose font library, parsing
 * nunito-latin-800-normal.woff here independently of the generator script.
 */
import { readFileSync } from 'node:fs';
import opentype, { type Font } from 'opentype.js';
import { describe, expect, it } from 'vitest';
import { LETTERS } from '$lib/pattern/fonts/letters.generated';
import { letterFont, parsePath } from '$lib/pattern/letter-font';
import type { PathCommand } from '$lib/pattern/lettering';

const bytes = readFileSync(
	new URL('../../src/lib/pattern/fonts/nunito-latin-800-normal.woff', import.meta.url)
);
const font: Font = opentype.parse(
	bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength)
);
const AZ = Array.from('ABCDEFGHIJKLMNOPQRSTUVWXYZ');

/** Only the drawing fields, with -0 read as 0 (the data file writes "0"). */
function plain(commands: PathCommand[]): PathCommand[] {
	return commands.map((c) => {
		const out: Record<string, unknown> = { type: c.type };
		for (const k of ['x1', 'y1', 'x2', 'y2', 'x', 'y'] as const)
			if (k in c) out[k] = (c as unknown as Record<string, number>)[k] + 0;
		return out as PathCommand;
	});
}

describe('letter data generated from the font file', () => {
	it('has the font’s em and cap height (opentype.js head and OS/2 tables)', () => {
		expect(LETTERS.unitsPerEm).toBe(font.unitsPerEm);
		expect(LETTERS.capHeight).toBe(font.tables.os2?.sCapHeight);
		expect(Object.keys(LETTERS.glyphs).sort()).toEqual(AZ);
	});

	it.each(AZ)('%s: same path commands, advance and bounds as opentype.js reads', (ch) => {
		// opentype.js: the glyph's path at one em, so in font units with y pointing down.
		const glyph = font.charToGlyph(ch);
		const path = glyph.getPath(0, 0, font.unitsPerEm);
		const data = LETTERS.glyphs[ch];
		expect(plain(parsePath(data.path))).toEqual(plain(path.commands));
		expect(data.advance).toBe(glyph.advanceWidth);
		const b = path.getBoundingBox();
		data.bounds.forEach((v, i) => expect(v).toBeCloseTo([b.x1, b.y1, b.x2, b.y2][i], 3));
	});

	it('has opentype.js’s kerning for all 676 pairs of capitals', () => {
		let kerned = 0;
		for (const a of AZ)
			for (const b of AZ) {
				const expected = font.getKerningValue(font.charToGlyph(a), font.charToGlyph(b));
				expect(LETTERS.kerning[a + b] ?? 0, `${a}${b}`).toBe(expected);
				if (expected) kerned++;
			}
		// A kerned font: pairs such as AV move closer (a zero table would pass the loop above).
		expect(kerned).toBeGreaterThan(50);
		expect(LETTERS.kerning.AV).toBeLessThan(0);
	});

	it.each(['AV', 'HMW', 'LTA', 'WAY', 'Q', 'KJ'])(
		'sets %s on one line as opentype.js does with kerning',
		(text) => {
			// opentype.js glyphs at the pen, the pen moved by advance plus kerning, as its
			// Font.forEachGlyph sets a line (its whole-string getPath stops on this font's ccmp
			// lookup, which it does not support).
			const glyphs = Array.from(text).map((ch) => font.charToGlyph(ch));
			let pen = 0;
			const expected = glyphs.flatMap((g, i) => {
				const commands = g.getPath(pen, 0, font.unitsPerEm).commands;
				pen += g.advanceWidth;
				if (i < glyphs.length - 1) pen += font.getKerningValue(g, glyphs[i + 1]);
				return commands;
			});
			const got = letterFont()
				.outline(text)
				.flatMap((g) => g.commands);
			expect(got.length).toBe(expected.length);
			const a = plain(got);
			const e = plain(expected);
			a.forEach((c, i) => {
				expect(c.type).toBe(e[i].type);
				for (const [k, v] of Object.entries(c))
					if (k !== 'type')
						expect(v).toBeCloseTo((e[i] as unknown as Record<string, number>)[k], 6);
			});
		}
	);

	it('rejects a malformed path instead of drawing half a letter', () => {
		expect(() => parsePath('M1 2L3')).toThrow(/bad L command/);
	});
});
