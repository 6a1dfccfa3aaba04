import { PDFDocument } from 'pdf-lib';
import { describe, expect, it } from 'vitest';
import { pageContent } from '../helpers/pdf-content';
import { pdfText } from '../helpers/pdf-text';
import { computePattern } from '$lib/pattern';
import { letterFont } from '$lib/pattern/letter-font';
import { templatePdf, tileGrid } from '$lib/server/pdf/template';

const font = letterFont();
const small = computePattern(
	{ diameterMm: 60, count: 1, initials: 'LF', widthMm: 90, lengthMm: 120 },
	{ font }
);
const long = computePattern(
	{ diameterMm: 90, count: 5, initials: 'AB', widthMm: 130, lengthMm: 520, border: { edgeMm: 26 } },
	{ font }
);

describe('1:1 template PDF', () => {
	it('A4 pages are 210 × 297 mm = 595.276 × 841.890 pt', async () => {
		const doc = await PDFDocument.load(
			await templatePdf(small, { paper: 'a4', orderRef: 'CS-1042' })
		);
		for (const page of doc.getPages()) {
			const { width, height } = page.getSize();
			// ISO 216: A4 is 210 × 297 mm; ISO 32000-1 §8.3.2.3: 1 pt = 1/72 in; 1 in = 25.4 mm (1959 agreement).
			expect(width).toBeCloseTo((210 / 25.4) * 72, 3);
			expect(height).toBeCloseTo((297 / 25.4) * 72, 3);
			expect(width).toBeCloseTo(595.276, 3);
			expect(height).toBeCloseTo(841.89, 3);
		}
	});

	it('US Letter pages are 612 × 792 pt', async () => {
		const doc = await PDFDocument.load(await templatePdf(small, { paper: 'letter' }));
		// US Letter 8.5 × 11 in at 72 pt/in (ISO 32000-1 §8.3.2.3).
		const { width, height } = doc.getPage(0).getSize();
		expect(width).toBeCloseTo(612, 6);
		expect(height).toBeCloseTo(792, 6);
	});

	it('draws a calibration square of 50 mm and says to print at actual size', async () => {
		const bytes = await templatePdf(small, { paper: 'a4', orderRef: 'CS-1042' });
		const doc = await PDFDocument.load(bytes);
		const text = pageContent(doc, 0);
		// A rectangle operator `x y w h re` with w = h = 50 mm = 50 / 25.4 · 72 pt = 141.732 pt.
		const squares = [...text.matchAll(/(-?[\d.]+) (-?[\d.]+) (-?[\d.]+) (-?[\d.]+) re/g)].filter(
			(m) => Math.abs(Number(m[3]) - 141.732) < 0.01 && Math.abs(Number(m[4]) - 141.732) < 0.01
		);
		expect(squares.length).toBe(1);
		// The words as a reader sees them (PDF.js), since the embedded fonts write glyph ids.
		const words = await pdfText(bytes);
		expect(words).toContain('Print at actual size / 100 %');
		expect(words).toContain('Order CS-1042');
		expect(words).toContain(`${small.chipCount} chips`);
	});

	it('tiles a layout longer than the printable area over several pages, with overlap', async () => {
		const grid = tileGrid(long.drawing.widthMm, long.drawing.heightMm, 'a4');
		expect(grid.rows).toBeGreaterThan(1);
		// Windows that overlap cover the whole drawing.
		expect((grid.rows - 1) * grid.step.y + grid.tileH).toBeGreaterThanOrEqual(
			long.drawing.heightMm
		);
		expect((grid.cols - 1) * grid.step.x + grid.tileW).toBeGreaterThanOrEqual(long.drawing.widthMm);
		expect(grid.step.y).toBeLessThan(grid.tileH);
		const doc = await PDFDocument.load(await templatePdf(long, { paper: 'a4' }));
		expect(doc.getPageCount()).toBe(1 + grid.rows * grid.cols);
		// Every tile page is clipped to its printable window and carries a drawing.
		for (let i = 1; i < doc.getPageCount(); i++) {
			const c = pageContent(doc, i);
			expect(c).toMatch(/ re\s+W\s+n/);
			expect(c).toContain(' c'); // Bézier curves of the arcs
		}
	});

	it('draws the rosette at true scale: a 90 mm rosette spans 255.118 pt', async () => {
		const one = computePattern({ diameterMm: 90, count: 1, widthMm: 120, lengthMm: 120 }, { font });
		const doc = await PDFDocument.load(await templatePdf(one, { paper: 'letter' }));
		const c = pageContent(doc, 1);
		const cm = /([\d.]+) 0 0 -([\d.]+) 0 0 cm/.exec(c);
		expect(cm).not.toBeNull();
		const scale = Number(cm![1]);
		// The chip fills: points on the curves (the end point of each m, l, c). Marks sit at the
		// top and bottom of the circle, so the vertical extremes are the rosette's diameter.
		const fills = c.split('Q').filter((b) => b.includes('0.9 0.88 0.85 rg'));
		expect(fills.length).toBe(12);
		const ys = fills.flatMap((b) =>
			[...b.matchAll(/(-?[\d.]+) (-?[\d.]+) (?:m|l|c)\b/g)].map((m) => Number(m[2]))
		);
		const span = (Math.max(...ys) - Math.min(...ys)) * scale;
		// 90 mm at 72 pt per inch and 25.4 mm per inch (ISO 32000-1 §8.3.2.3; 1959 inch) = 255.118 pt.
		expect(span).toBeCloseTo((90 / 25.4) * 72, 2);
		expect(span).toBeCloseTo(255.118, 2);
	});
});
