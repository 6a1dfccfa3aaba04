import { PDFDocument, rgb } from 'pdf-lib';
import { PdfFonts } from '../pdf/fonts';
import { PAPER_MM, PT_PER_MM, type Paper } from '../pdf/template';

export type ChecklistLine = { title: string; woodName: string; quantity: number };

/**
 * The load-out as a packing checklist: one row per piece and wood with a box to tick and a
 * box for the count back, on A4 or US Letter, in the embedded fonts (names in any script).
 */
export async function checklistPdf(
	fair: { name: string; place: string; startsOn: string; endsOn: string },
	lines: ChecklistLine[],
	paper: Paper
): Promise<Uint8Array> {
	const doc = await PDFDocument.create();
	doc.setTitle(`Load-out checklist: ${fair.name}`);
	const fonts = await PdfFonts.for(doc);
	await fonts.cover(fair.name, fair.place, ...lines.map((l) => `${l.title}, ${l.woodName}`));
	const w = PAPER_MM[paper].w * PT_PER_MM;
	const h = PAPER_MM[paper].h * PT_PER_MM;
	const margin = 15 * PT_PER_MM;
	const rowH = 22;
	const ink = rgb(0.12, 0.09, 0.07);
	let page = doc.addPage([w, h]);
	let y = h - margin;

	const header = () => {
		fonts.draw(page, `Load-out checklist: ${fair.name}`, {
			x: margin,
			y: y - 16,
			size: 16,
			weight: 'bold',
			color: ink
		});
		const when =
			fair.startsOn === fair.endsOn ? fair.startsOn : `${fair.startsOn} to ${fair.endsOn}`;
		fonts.draw(page, `${fair.place}, ${when}`, { x: margin, y: y - 34, size: 11, color: ink });
		y -= 60;
		const head = { y, size: 9, weight: 'bold' } as const;
		fonts.draw(page, 'Packed', { ...head, x: margin });
		fonts.draw(page, 'Piece and wood', { ...head, x: margin + 50 });
		fonts.draw(page, 'Count', { ...head, x: w - margin - 120 });
		fonts.draw(page, 'Back', { ...head, x: w - margin - 50 });
		y -= 8;
	};
	header();
	let total = 0;
	for (const l of lines) {
		if (y - rowH < margin + 40) {
			page = doc.addPage([w, h]);
			y = h - margin;
			header();
		}
		y -= rowH;
		page.drawRectangle({
			x: margin + 4,
			y: y - 2,
			width: 14,
			height: 14,
			borderColor: ink,
			borderWidth: 1
		});
		// Whole characters only: slicing code units could split a letter outside the BMP.
		fonts.draw(page, [...`${l.title}, ${l.woodName}`].slice(0, 70).join(''), {
			x: margin + 50,
			y: y + 1,
			size: 11,
			color: ink
		});
		fonts.draw(page, String(l.quantity), {
			x: w - margin - 110,
			y: y + 1,
			size: 11,
			weight: 'bold',
			color: ink
		});
		page.drawRectangle({
			x: w - margin - 52,
			y: y - 4,
			width: 40,
			height: 18,
			borderColor: ink,
			borderWidth: 0.8
		});
		page.drawLine({
			start: { x: margin, y: y - 7 },
			end: { x: w - margin, y: y - 7 },
			thickness: 0.3,
			color: rgb(0.7, 0.66, 0.6)
		});
		total += l.quantity;
	}
	y -= 30;
	fonts.draw(
		page,
		`${total} pieces in ${lines.length} lines. Also: cash float, card reader, price tags, table cloth.`,
		{ x: margin, y, size: 10, color: ink }
	);
	return doc.save();
}
