/**
 * The text a PDF shows, read with PDF.js (Mozilla's general-purpose PDF reader, from npm), so the
 * tests need no system program such as pdftotext. The legacy build runs on Node 20.
 */
import { createRequire } from 'node:module';
import path from 'node:path';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';

/** The 14 standard fonts' metrics ship inside the package. */
const standardFontDataUrl =
	path.join(
		path.dirname(createRequire(import.meta.url).resolve('pdfjs-dist/package.json')),
		'standard_fonts'
	) + '/';

export async function pdfText(bytes: Uint8Array): Promise<string> {
	const doc = await getDocument({
		data: new Uint8Array(bytes),
		useSystemFonts: false,
		standardFontDataUrl
	}).promise;
	const pages: string[] = [];
	for (let n = 1; n <= doc.numPages; n++) {
		const content = await (await doc.getPage(n)).getTextContent();
		let text = '';
		let end: { x: number; y: number } | null = null;
		for (const i of content.items) {
			if (!('str' in i)) continue;
			const [, , , , x, y] = i.transform as number[];
			// Text drawn in several runs (one per font) touches end to start: join it without a
			// space, so "Łódź" reads back whole; anything else is a new word or line.
			const touches = end && Math.abs(end.y - y) < 0.5 && Math.abs(end.x - x) < 0.5;
			text += (text && !touches ? ' ' : '') + i.str;
			end = { x: x + i.width, y };
		}
		pages.push(text);
	}
	await doc.destroy();
	return pages.join('\n');
}
