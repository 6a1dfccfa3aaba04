/**
 * Every line of the 1:1 template prints whole. A stroke is centred on its path (ISO 32000-1:2008
 * §8.5.3.2) and the clipping path cuts whatever lies outside it (§8.5.4), so an outline lying on
 * a tile's clip edge keeps only half its width. The distances of the registration marks from the
 * outlines are measured with @flatten-js/core, not with the template's own geometry.
 */
import Flatten from '@flatten-js/core';
import { PDFDocument } from 'pdf-lib';
import { describe, expect, it } from 'vitest';
import { pageContent } from '../helpers/pdf-content';
import { computePattern } from '$lib/pattern';
import type { PatternResult } from '$lib/pattern/types';
import {
	PAPER_MM,
	MARGIN_MM,
	outlineDistance,
	registrationMarks,
	templatePdf,
	tileGrid
} from '$lib/server/pdf/template';

type Block = { tx: number; ty: number; s: number; width: number; points: [number, number][] };
type Tile = { clip: { x: number; y: number; w: number; h: number }; strokes: Block[] };

/** The clip rectangle and every stroked path of a tile page, read back from its operators. */
function readTile(text: string): Tile {
	const c = /(-?[\d.]+) (-?[\d.]+) (-?[\d.]+) (-?[\d.]+) re\s+W\s+n/.exec(text)!;
	const clip = { x: +c[1], y: +c[2], w: +c[3], h: +c[4] };
	const strokes = text
		.split(/\nQ/)
		.filter((b) => /\nS\s*$/.test(b))
		.map((b) => {
			const t = /1 0 0 1 (-?[\d.]+) (-?[\d.]+) cm/.exec(b)!;
			const s = /([\d.]+) 0 0 -[\d.]+ 0 0 cm/.exec(b)!;
			const w = /([\d.]+) w/.exec(b)!;
			const points = [...b.matchAll(/(-?[\d.]+) (-?[\d.]+) (?:m|l)\b/g)].map(
				(m) => [+m[1], +m[2]] as [number, number]
			);
			return { tx: +t[1], ty: +t[2], s: +s[1], width: +w[1] * +s[1], points };
		});
	return { clip, strokes };
}

async function tiles(result: PatternResult, paper: 'a4' | 'letter'): Promise<Tile[]> {
	const doc = await PDFDocument.load(await templatePdf(result, { paper }));
	return Array.from({ length: doc.getPageCount() - 1 }, (_, i) =>
		readTile(pageContent(doc, i + 1))
	);
}

/** The blank's outline on a tile: the stroke whose corners are the blank's corners. */
function outlineOn(tile: Tile, w: number, l: number) {
	return tile.strokes.find(
		(b) =>
			b.points.length === 4 &&
			b.points.some(([x, y]) => x === w && y === l) &&
			b.points.some(([x, y]) => x === 0 && y === 0)
	)!;
}

/**
 * Each of the blank's four edges must be inside some tile's clip by at least half the stroke
 * width, across the edge: that tile prints it at full width.
 */
function wholeEdges(list: Tile[], w: number, l: number) {
	const edges = [
		{ name: 'left', axis: 'x', at: 0 },
		{ name: 'right', axis: 'x', at: w },
		{ name: 'top', axis: 'y', at: 0 },
		{ name: 'bottom', axis: 'y', at: l }
	] as const;
	return edges
		.filter((e) =>
			list.some((tile) => {
				const o = outlineOn(tile, w, l);
				const half = o.width / 2;
				const { clip } = tile;
				if (e.axis === 'x') {
					const px = o.tx + o.s * e.at;
					return px - half >= clip.x - 1e-6 && px + half <= clip.x + clip.w + 1e-6;
				}
				const py = o.ty - o.s * e.at;
				return py - half >= clip.y - 1e-6 && py + half <= clip.y + clip.h + 1e-6;
			})
		)
		.map((e) => e.name);
}

describe('1:1 template: outlines print whole', () => {
	const a4 = PAPER_MM.a4;
	// The blank exactly as wide and as long as the printable window of an A4 tile: before, its
	// outline lay on all four clip edges.
	const tileW = a4.w - 2 * MARGIN_MM;
	const fitW = computePattern({ diameterMm: 60, count: 1, widthMm: tileW, lengthMm: 200 });
	const grid = tileGrid(fitW.drawing.widthMm, fitW.drawing.heightMm, 'a4');
	const fitH = computePattern({ diameterMm: 60, count: 1, widthMm: 90, lengthMm: grid.tileH });

	it('a blank as wide as the tile: all four edges print whole on some tile', async () => {
		const list = await tiles(fitW, 'a4');
		expect(wholeEdges(list, tileW, 200)).toEqual(['left', 'right', 'top', 'bottom']);
	});

	it('a blank as long as the tile: all four edges print whole on some tile', async () => {
		const list = await tiles(fitH, 'a4');
		expect(wholeEdges(list, 90, grid.tileH)).toEqual(['left', 'right', 'top', 'bottom']);
	});

	it('a long board over many Letter tiles: all four edges print whole', async () => {
		const long = computePattern({ diameterMm: 90, count: 5, widthMm: 130, lengthMm: 520 });
		const list = await tiles(long, 'letter');
		expect(list.length).toBeGreaterThan(2);
		expect(wholeEdges(list, 130, 520)).toEqual(['left', 'right', 'top', 'bottom']);
	});
});

describe('1:1 template: registration marks keep clear of outlines', () => {
	/** Mark centres from the path: each mark starts with `M{x-4} {y}h8`. */
	const centres = (path: string) =>
		[...path.matchAll(/M(-?[\d.]+) (-?[\d.]+)h8/g)].map((m) => ({ x: +m[1] + 4, y: +m[2] }));

	const cases = [
		{
			name: 'a long board over several tiles',
			result: computePattern({ diameterMm: 90, count: 5, widthMm: 130, lengthMm: 520 })
		},
		{
			name: 'a curved-top bottle holder with a border band',
			result: computePattern({
				diameterMm: 80,
				count: 3,
				widthMm: 110,
				lengthMm: 330,
				curvedTop: true,
				border: { edgeMm: 24 }
			})
		}
	];

	for (const c of cases)
		it(c.name, () => {
			const d = c.result.drawing;
			const grid = tileGrid(d.widthMm, d.heightMm, 'a4');
			const marks = centres(registrationMarks(grid, outlineDistance(d)));
			const strips = (grid.cols - 1) * grid.rows + (grid.rows - 1) * grid.cols;
			expect(strips).toBeGreaterThan(0);
			expect(marks.length).toBe(2 * strips);
			// The outlines as @flatten-js/core shapes.
			const { point, segment, arc } = Flatten;
			const w = d.blank.widthMm;
			const l = d.blank.lengthMm;
			const shapes: (Flatten.Segment | Flatten.Arc)[] = [];
			const top = d.blank.curvedTop ? w / 2 : 0;
			shapes.push(
				segment(point(w, top), point(w, l)),
				segment(point(w, l), point(0, l)),
				segment(point(0, l), point(0, top))
			);
			// The arched top: the half circle over the width (y grows down the board).
			if (d.blank.curvedTop) shapes.push(arc(point(w / 2, w / 2), w / 2, Math.PI, 2 * Math.PI));
			else shapes.push(segment(point(0, 0), point(w, 0)));
			if (d.border) {
				const b = d.border;
				const corners = [
					point(b.x, b.y),
					point(b.x + b.edgeMm, b.y),
					point(b.x + b.edgeMm, b.y + b.lengthMm),
					point(b.x, b.y + b.lengthMm)
				];
				corners.forEach((p, i) => shapes.push(segment(p, corners[(i + 1) % 4])));
			}
			for (const m of marks) {
				const nearest = Math.min(...shapes.map((s) => point(m.x, m.y).distanceTo(s)[0]));
				// The mark reaches 4 mm from its centre (an 8 mm cross): it must not touch any outline.
				expect(nearest).toBeGreaterThan(4);
			}
		});
});
