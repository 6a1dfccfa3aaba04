/**
 * Fonts for every PDF the workshop prints (slips, templates, checklists). The 14 standard PDF
 * fonts only speak WinAnsi, so "Łódź" or a gift note with an emoji would print as "?". Instead
 * each piece of text is split into runs, each drawn with the first embedded font that has its
 * letters: Nunito (Latin, Latin Extended, Cyrillic, Greek, Vietnamese), then Noto Sans JP (kana,
 * kanji, most CJK), then Noto Emoji (monochrome outlines). The fonts come from their @fontsource
 * packages, which split each font into files by Unicode range; the ranges are read from the
 * packages' own CSS, and only the files a document needs are embedded (subset to the glyphs
 * used). A character none of them has prints as a visible placeholder, never a silent "?".
 * Relative imports only: the bench runs the PDF code under tsx.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import fontkit from '@pdf-lib/fontkit';
import type { PDFDocument, PDFFont, PDFPage, RGB } from 'pdf-lib';

export type Weight = 'regular' | 'bold';
/** Printed where no embedded font has the character; the order page warns the owner. */
export const PLACEHOLDER = '[?]';

type FaceFile = { file: string; ranges: [number, number][] };

const FAMILIES = ['@fontsource/nunito', '@fontsource/noto-sans-jp', '@fontsource/noto-emoji'];
const WEIGHT_FILE: Record<Weight, string> = { regular: '400.css', bold: '700.css' };

/** The files of one weight of one family with the code points each covers, from its CSS. */
function readFaces(pkg: string, weight: Weight): FaceFile[] {
	const dir = path.dirname(createRequire(import.meta.url).resolve(`${pkg}/package.json`));
	const css = readFileSync(path.join(dir, WEIGHT_FILE[weight]), 'utf8');
	const faces: FaceFile[] = [];
	for (const block of css.split('@font-face').slice(1)) {
		// fontkit reads WOFF (zlib) but not WOFF2 (Brotli): take the .woff each face also ships.
		const file = /url\(\.\/(files\/[^)]+\.woff)\)/.exec(block)?.[1];
		const range = /unicode-range:\s*([^;]+);/.exec(block)?.[1];
		if (!file || !range) continue;
		const ranges = range.split(',').map((r): [number, number] => {
			const [lo, hi] = r.trim().replace(/^U\+/i, '').split('-');
			return [parseInt(lo, 16), parseInt(hi ?? lo, 16)];
		});
		faces.push({ file: path.join(dir, file), ranges });
	}
	return faces;
}

let facesCache: Record<Weight, FaceFile[]> | null = null;
function faces(): Record<Weight, FaceFile[]> {
	facesCache ??= {
		regular: FAMILIES.flatMap((f) => readFaces(f, 'regular')),
		bold: FAMILIES.flatMap((f) => readFaces(f, 'bold'))
	};
	return facesCache;
}

/** Characters that take no room and need no glyph of their own (joiners, variation selectors). */
function silent(ch: string): boolean {
	const cp = ch.codePointAt(0)!;
	return (cp >= 0x200b && cp <= 0x200f) || cp === 0x2060 || (cp >= 0xfe00 && cp <= 0xfe0f);
}

function faceFor(cp: number, weight: Weight): FaceFile | null {
	return faces()[weight].find((f) => f.ranges.some(([lo, hi]) => cp >= lo && cp <= hi)) ?? null;
}

/** The characters of `text` that no embedded font can print (each once, in order). */
export function unprintable(text: string): string[] {
	const out = new Set<string>();
	for (const ch of text) {
		if (ch === '\n' || ch === '\t' || silent(ch)) continue;
		if (!faceFor(ch.codePointAt(0)!, 'regular')) out.add(ch);
	}
	return [...out];
}

type Run = { text: string; font: PDFFont | null };
type DrawOptions = { x: number; y: number; size: number; weight?: Weight; color?: RGB };

/** The fonts of one document: embeds each face file the first time a text needs it. */
export class PdfFonts {
	private embedded = new Map<string, PDFFont>();
	private fallback: PDFFont | null = null;
	private constructor(private doc: PDFDocument) {}

	static async for(doc: PDFDocument): Promise<PdfFonts> {
		doc.registerFontkit(fontkit);
		const fonts = new PdfFonts(doc);
		await fonts.cover(`Aa0 ${PLACEHOLDER}`);
		return fonts;
	}

	/** Embeds whatever faces these texts need, in both weights. Call before drawing them. */
	async cover(...texts: (string | null | undefined)[]) {
		for (const text of texts) {
			if (!text) continue;
			for (const ch of text) {
				for (const weight of ['regular', 'bold'] as const) {
					const face = faceFor(ch.codePointAt(0)!, weight);
					if (face && !this.embedded.has(face.file)) {
						const font = await this.doc.embedFont(readFileSync(face.file), { subset: true });
						this.embedded.set(face.file, font);
					}
				}
			}
		}
		this.fallback ??= this.embedded.get(faceFor(0x41, 'regular')!.file) ?? null;
	}

	/** Splits text into runs of one font; a character with no font becomes the placeholder. */
	runs(text: string, weight: Weight = 'regular'): Run[] {
		const out: Run[] = [];
		for (const ch of text) {
			if (silent(ch)) continue;
			const face = faceFor(ch.codePointAt(0)!, weight);
			const font = face ? (this.embedded.get(face.file) ?? null) : null;
			const piece = font ? ch : PLACEHOLDER;
			const use = font ?? this.fallback;
			const last = out.at(-1);
			if (last && last.font === use) last.text += piece;
			else out.push({ text: piece, font: use });
		}
		return out;
	}

	width(text: string, size: number, weight: Weight = 'regular'): number {
		return this.runs(text, weight).reduce(
			(w, r) => w + (r.font ? r.font.widthOfTextAtSize(r.text, size) : 0),
			0
		);
	}

	draw(page: PDFPage, text: string, o: DrawOptions) {
		let x = o.x;
		for (const r of this.runs(text, o.weight)) {
			if (!r.font) continue;
			page.drawText(r.text, { x, y: o.y, size: o.size, font: r.font, color: o.color });
			x += r.font.widthOfTextAtSize(r.text, o.size);
		}
	}

	/** Words into lines no wider than `widthPt`; a word longer than a line is left whole. */
	wrap(text: string, size: number, widthPt: number, weight: Weight = 'regular'): string[] {
		const lines: string[] = [];
		let line = '';
		for (const w of text.split(/\s+/)) {
			const next = line ? `${line} ${w}` : w;
			if (this.width(next, size, weight) > widthPt && line) {
				lines.push(line);
				line = w;
			} else line = next;
		}
		if (line) lines.push(line);
		return lines;
	}
}
