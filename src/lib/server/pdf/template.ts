/**
 * The 1:1 carving template as a PDF. PDF user space is 1/72 inch (ISO 32000-1 §8.3.2.3) and the
 * inch is exactly 25.4 mm, so 1 mm = 72 / 25.4 pt. Page 1 carries the calibration square, the
 * "print at actual size" note, the counts and the layout steps; the drawing follows at true
 * scale, tiled over as many pages as it needs, neighbouring tiles overlapping by OVERLAP_MM
 * with registration marks to lay over each other.
 */
import {
	PDFDocument,
	clip,
	endPath,
	popGraphicsState,
	pushGraphicsState,
	rectangle,
	rgb,
	setLineWidth,
	setStrokingRgbColor,
	stroke as strokeOp,
	type PDFPage
} from 'pdf-lib';
import { PdfFonts } from './fonts';
import type { PatternResult } from '../../pattern/types';
import { facePath } from '../../pattern/paths';
import { fmt } from '../../pattern/geometry';

export const PT_PER_MM = 72 / 25.4;
/** A4 210 × 297 mm (ISO 216); US Letter 8.5 × 11 in. */
export const PAPER_MM = { a4: { w: 210, h: 297 }, letter: { w: 215.9, h: 279.4 } } as const;
export type Paper = keyof typeof PAPER_MM;

export const MARGIN_MM = 12;
export const HEADER_MM = 9;
export const OVERLAP_MM = 12;
/**
 * Plain paper kept round the drawing on the outer tiles. A stroke is centred on its path
 * (ISO 32000-1 §8.5.3.2) and a clip cuts it (§8.5.4): an outline lying on a tile's edge would
 * print at half width, under one dot at 100 dpi. With this pad every outer line sits inside.
 */
export const EDGE_PAD_MM = 2;
/** Registration marks: a cross 8 mm long with a 5 mm ring, kept this far off any outline. */
const MARK_REACH_MM = 4;
const MARK_CLEAR_MM = 1.5;
export const CALIBRATION_MM = 50;

export type TemplateOptions = { paper: Paper; orderRef?: string; title?: string };

const INK = rgb(0.12, 0.09, 0.07);
const SOFT = rgb(0.45, 0.4, 0.36);
const CHIP_FILL = rgb(0.9, 0.88, 0.85);
const k = PT_PER_MM;

export type TileGrid = {
	cols: number;
	rows: number;
	tileW: number;
	tileH: number;
	step: { x: number; y: number };
};

/** How the drawing, with EDGE_PAD_MM of paper round it, splits into page-sized windows (mm). */
export function tileGrid(widthMm: number, heightMm: number, paper: Paper): TileGrid {
	const page = PAPER_MM[paper];
	const tileW = page.w - 2 * MARGIN_MM;
	const tileH = page.h - 2 * MARGIN_MM - HEADER_MM;
	const count = (total: number, size: number) =>
		total <= size ? 1 : Math.ceil((total - OVERLAP_MM) / (size - OVERLAP_MM));
	return {
		cols: count(widthMm + 2 * EDGE_PAD_MM, tileW),
		rows: count(heightMm + 2 * EDGE_PAD_MM, tileH),
		tileW,
		tileH,
		step: { x: tileW - OVERLAP_MM, y: tileH - OVERLAP_MM }
	};
}

/** The drawing's window (mm, drawing coordinates) that a tile shows. */
export function tileWindow(grid: TileGrid, row: number, col: number) {
	const x = col * grid.step.x - EDGE_PAD_MM;
	const y = row * grid.step.y - EDGE_PAD_MM;
	return { x, y, w: grid.tileW, h: grid.tileH };
}

function tileName(row: number, col: number) {
	return `${String.fromCharCode(65 + (row % 26))}${col + 1}`;
}

export async function templatePdf(
	result: PatternResult,
	opts: TemplateOptions
): Promise<Uint8Array> {
	const page = PAPER_MM[opts.paper];
	const pageW = page.w * k;
	const pageH = page.h * k;
	const doc = await PDFDocument.create();
	doc.setTitle(
		`Carving layout${opts.title ? ` — ${opts.title}` : ''}${opts.orderRef ? ` — ${opts.orderRef}` : ''}`
	);
	doc.setCreator('Chipstall');
	doc.setProducer('Chipstall');
	const fonts = await PdfFonts.for(doc);
	await fonts.cover(
		opts.title,
		opts.orderRef,
		...result.steps,
		...result.warnings.map((w) => w.message)
	);
	const d = result.drawing;
	const grid = tileGrid(d.widthMm, d.heightMm, opts.paper);

	infoPage(doc.addPage([pageW, pageH]), result, opts, grid, fonts);

	for (let row = 0; row < grid.rows; row++) {
		for (let col = 0; col < grid.cols; col++) {
			const p = doc.addPage([pageW, pageH]);
			const win = tileWindow(grid, row, col);
			const title = [
				`Tile ${tileName(row, col)}`,
				grid.rows * grid.cols > 1
					? `row ${row + 1} of ${grid.rows}, column ${col + 1} of ${grid.cols}`
					: 'whole layout',
				opts.orderRef ? `order ${opts.orderRef}` : '',
				'print at actual size / 100 %'
			]
				.filter(Boolean)
				.join('  ·  ');
			fonts.draw(p, title, {
				x: MARGIN_MM * k,
				y: pageH - (MARGIN_MM + 5) * k,
				size: 8.5,
				weight: 'bold',
				color: INK
			});
			if (grid.rows * grid.cols > 1) {
				fonts.draw(
					p,
					`Tiles overlap by ${OVERLAP_MM} mm: lay the round marks of neighbouring tiles over each other, then tape.`,
					{ x: MARGIN_MM * k, y: pageH - (MARGIN_MM + 8.5) * k, size: 7, color: SOFT }
				);
			}
			drawTile(p, result, grid, win.x, win.y, pageH);
		}
	}
	return doc.save();
}

function infoPage(
	p: PDFPage,
	r: PatternResult,
	opts: TemplateOptions,
	grid: TileGrid,
	fonts: PdfFonts
) {
	const text = (
		s: string,
		o: { x: number; y: number; size: number; bold?: boolean; color?: typeof INK }
	) => fonts.draw(p, s, { ...o, weight: o.bold ? 'bold' : 'regular', color: o.color ?? INK });
	const pageW = p.getWidth();
	const pageH = p.getHeight();
	const left = MARGIN_MM * k;
	const width = pageW - 2 * left;
	let y = pageH - MARGIN_MM * k - 14;
	text(`Carving layout${opts.title ? ` — ${opts.title}` : ''}`, {
		x: left,
		y,
		size: 16,
		bold: true,
		color: INK
	});
	y -= 18;
	if (opts.orderRef) {
		text(`Order ${opts.orderRef}`, { x: left, y, size: 11, bold: true });
		y -= 16;
	}
	text('Print at actual size / 100 %. Turn off "fit to page" and any scaling.', {
		x: left,
		y,
		size: 11,
		bold: true,
		color: INK
	});
	y -= 14;
	text(
		`Then measure the square: it must be ${CALIBRATION_MM} mm on each side, or the layout is not true to size.`,
		{
			x: left,
			y,
			size: 9,
			color: SOFT
		}
	);
	y -= 10;
	// The calibration square, exactly 50 mm.
	const sq = CALIBRATION_MM * k;
	// A true rectangle operator, so anyone reading the file sees 50 mm in its numbers.
	p.pushOperators(
		pushGraphicsState(),
		setStrokingRgbColor(0.12, 0.09, 0.07),
		setLineWidth(0.6),
		rectangle(left, y - sq, sq, sq),
		strokeOp(),
		popGraphicsState()
	);
	text(`${CALIBRATION_MM} mm`, {
		x: left + sq / 2 - 12,
		y: y - sq / 2 - 3,
		size: 9,
		color: INK
	});
	const facts = [
		`Compass radius ${fmt(r.compassRadiusMm, 1)} mm, ${r.rosettes.length} rosette${r.rosettes.length > 1 ? 's' : ''}`,
		`${r.chipCount} chips${r.letterCount ? ` and ${r.letterCount} letter${r.letterCount > 1 ? 's' : ''}` : ''}`,
		`Total cut length ${Math.round(r.cutLengthMm)} mm`,
		`About ${r.estimateMinutes} minutes of carving`,
		`Blank ${fmt(r.drawing.blank.widthMm, 1)} × ${fmt(r.drawing.blank.lengthMm, 1)} mm`,
		grid.rows * grid.cols > 1
			? `Drawing on ${grid.rows * grid.cols} pages: ${grid.cols} across × ${grid.rows} down`
			: 'Drawing on the next page'
	];
	let fy = y - 10;
	for (const f of facts) {
		text(f, { x: left + sq + 10 * k, y: fy, size: 10 });
		fy -= 14;
	}
	y -= sq + 18;
	text('Layout steps', { x: left, y, size: 12, bold: true });
	y -= 15;
	const lines = [
		...r.steps.map((s, i) => ({ text: `${i + 1}. ${s}`, bold: false })),
		...r.warnings.map((w) => ({ text: `Check: ${w.message}`, bold: true })),
		{
			text: 'Knives cut: carve away from the hand holding the work. Some wood dust irritates skin and airways.',
			bold: false
		}
	];
	for (const l of lines) {
		for (const part of fonts.wrap(l.text, 9.5, width, l.bold ? 'bold' : 'regular')) {
			if (y < MARGIN_MM * k) return;
			text(part, { x: left, y, size: 9.5, bold: l.bold });
			y -= 12.5;
		}
		y -= 3;
	}
}

function drawTile(
	p: PDFPage,
	r: PatternResult,
	grid: TileGrid,
	x0: number,
	y0: number,
	pageH: number
) {
	const d = r.drawing;
	const left = MARGIN_MM;
	const top = MARGIN_MM + HEADER_MM;
	const at = { x: (left - x0) * k, y: pageH - (top - y0) * k, scale: k };
	p.pushOperators(
		pushGraphicsState(),
		rectangle(left * k, pageH - (top + grid.tileH) * k, grid.tileW * k, grid.tileH * k),
		clip(),
		endPath()
	);
	const stroke = (path: string, width: number, color = INK, dash?: number[]) => {
		if (path)
			p.drawSvgPath(path, {
				...at,
				borderColor: color,
				borderWidth: width / k,
				borderDashArray: dash?.map((v) => v / k)
			});
	};
	for (const c of d.chips)
		if (c.edges.length) p.drawSvgPath(facePath(c.edges), { ...at, color: CHIP_FILL });
	stroke(d.blank.outline, 0.8);
	stroke(`M${fmt(d.centreLineX)} 0V${fmt(d.blank.lengthMm)}`, 0.4, SOFT, [4, 2.5]);
	stroke(d.lines, 0.45);
	const marks = r.rosettes
		.map((c) => `M${fmt(c.x - 2.5)} ${fmt(c.y)}h5M${fmt(c.x)} ${fmt(c.y - 2.5)}v5`)
		.join('');
	stroke(marks, 0.4);
	if (d.lettering) {
		const m = d.lettering.medallion;
		stroke(
			`M${fmt(m.x - m.r)} ${fmt(m.y)}a${fmt(m.r)} ${fmt(m.r)} 0 1 0 ${fmt(2 * m.r)} 0a${fmt(m.r)} ${fmt(m.r)} 0 1 0 ${fmt(-2 * m.r)} 0`,
			0.5
		);
		stroke(d.lettering.letters.map((l) => l.d).join(''), 0.45);
	}
	if (d.border) {
		const b = d.border;
		stroke(`M${fmt(b.x)} ${fmt(b.y)}h${fmt(b.edgeMm)}v${fmt(b.lengthMm)}h${fmt(-b.edgeMm)}Z`, 0.8);
		stroke(
			b.rules.map((v) => `M${fmt(b.x + v)} ${fmt(b.y)}V${fmt(b.y + b.lengthMm)}`).join(''),
			0.35,
			SOFT
		);
		const tri = b.triangles
			.map((t) => `M${t.map((q) => `${fmt(b.x + q.y)} ${fmt(b.y + q.x)}`).join('L')}Z`)
			.join('');
		stroke(tri, 0.35);
	}
	stroke(registrationMarks(grid, outlineDistance(r.drawing)), 0.4);
	p.pushOperators(popGraphicsState());
}

/**
 * Distance (mm) from a point to the nearest outline: the blank's edges (its curved top end as an
 * arc) and the border strip's edges.
 */
export function outlineDistance(d: PatternResult['drawing']): (x: number, y: number) => number {
	const segments: [number, number, number, number][] = [];
	const rect = (x: number, y: number, w: number, h: number, top = true) => {
		if (top) segments.push([x, y, x + w, y]);
		segments.push([x + w, y, x + w, y + h], [x + w, y + h, x, y + h], [x, y + h, x, y]);
	};
	const b = d.blank;
	const arch = b.curvedTop && b.lengthMm >= b.widthMm / 2;
	const r = b.widthMm / 2;
	if (arch) rect(0, r, b.widthMm, b.lengthMm - r, false);
	else rect(0, 0, b.widthMm, b.lengthMm);
	if (d.border) rect(d.border.x, d.border.y, d.border.edgeMm, d.border.lengthMm);
	return (x, y) => {
		let best = Infinity;
		for (const [x1, y1, x2, y2] of segments) {
			const dx = x2 - x1;
			const dy = y2 - y1;
			const t = Math.max(
				0,
				Math.min(1, ((x - x1) * dx + (y - y1) * dy) / (dx * dx + dy * dy || 1))
			);
			best = Math.min(best, Math.hypot(x - (x1 + t * dx), y - (y1 + t * dy)));
		}
		// The arched top is the upper half of the circle through both long edges.
		if (arch) {
			const onArc = y <= r ? Math.abs(Math.hypot(x - r, y - r) - r) : Math.hypot(x - r, y - r) - r;
			best = Math.min(best, Math.abs(onArc));
		}
		return best;
	};
}

/** Where along an overlap strip the marks may go: first the quarters, then nearby places. */
const MARK_PLACES = [0.25, 0.75, 0.15, 0.35, 0.65, 0.85, 0.05, 0.45, 0.55, 0.95];

/**
 * Round marks in the middle of every overlap strip: they print on both tiles that share the
 * strip, at the same place on the drawing, so laying one over the other aligns the pages. Two
 * per strip, at the first places along it that keep clear of every outline.
 */
export function registrationMarks(grid: TileGrid, distance: (x: number, y: number) => number) {
	const mark = (x: number, y: number) =>
		`M${fmt(x - 4)} ${fmt(y)}h8M${fmt(x)} ${fmt(y - 4)}v8M${fmt(x - 2.5)} ${fmt(y)}a2.5 2.5 0 1 0 5 0a2.5 2.5 0 1 0 -5 0`;
	const clear = (x: number, y: number) => distance(x, y) >= MARK_REACH_MM + MARK_CLEAR_MM;
	const two = (at: (f: number) => { x: number; y: number }) =>
		MARK_PLACES.map(at)
			.filter((p) => clear(p.x, p.y))
			.slice(0, 2)
			.map((p) => mark(p.x, p.y))
			.join('');
	let path = '';
	for (let row = 0; row < grid.rows; row++)
		for (let col = 0; col < grid.cols; col++) {
			const win = tileWindow(grid, row, col);
			// The strip shared with the tile to the right, and with the one below.
			if (col + 1 < grid.cols)
				path += two((f) => ({ x: win.x + win.w - OVERLAP_MM / 2, y: win.y + win.h * f }));
			if (row + 1 < grid.rows)
				path += two((f) => ({ x: win.x + win.w * f, y: win.y + win.h - OVERLAP_MM / 2 }));
		}
	return path;
}
