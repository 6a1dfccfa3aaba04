/**
 * Border bands on an edge: lines ruled at offsets from the edge's centre, and a row of squares
 * of a set step counted from a start mark, each square divided into triangle chips.
 * Coordinates are local to the edge strip: u runs along the length (from the start end),
 * v across the edge (0 at one face, edgeMm at the other).
 */
import type { Point } from './geometry';

export type BorderInput = {
	/** Width of the edge the band is ruled on, e.g. the blank's thickness. */
	edgeMm: number;
	/** Steps outward from the edge centre, each added to the last: [5, 2, 1.5] rules ±5, ±7, ±8.5. */
	offsetsMm: number[];
	/** Side of the grid squares. */
	stepMm: number;
	/** The start mark, measured from the end of the edge. */
	startMm: number;
	/** Length of edge to fill from the start mark; defaults to the edge length less a start mark at each end. */
	runMm?: number;
	/**
	 * Triangles per square: 1 = the half below the diagonal (a saw-tooth row), 2 = both halves
	 * of one diagonal, 4 = the quarters cut by both diagonals.
	 */
	trianglesPerSquare: 1 | 2 | 4;
};

export const BORDER_DEFAULTS: Omit<BorderInput, 'edgeMm'> = {
	offsetsMm: [5, 2, 1.5],
	stepMm: 5,
	startMm: 5,
	trianglesPerSquare: 2
};

export type BorderLayout = {
	edgeMm: number;
	lengthMm: number;
	/** Ruled lines across the edge, as distances from the first face (the centre line first). */
	rules: number[];
	/** Grid square corners: the band between the innermost pair of rules. */
	columns: number;
	rows: number;
	gridStart: Point;
	stepMm: number;
	triangles: Point[][];
	warnings: { code: string; message: string }[];
};

export function layoutBorder(input: BorderInput, edgeLengthMm: number): BorderLayout {
	const { edgeMm, offsetsMm, stepMm, startMm, trianglesPerSquare } = input;
	const warnings: BorderLayout['warnings'] = [];
	const centre = edgeMm / 2;
	const rules = [centre];
	let off = 0;
	for (const o of offsetsMm) {
		off += o;
		if (off >= centre) {
			warnings.push({
				code: 'border-offset-off-edge',
				message: `A rule ${fmtMm(off)} from the centre falls off a ${fmtMm(edgeMm)} edge; it is left out.`
			});
			break;
		}
		rules.push(centre - off, centre + off);
	}
	const band = 2 * (offsetsMm[0] ?? 0);
	const rows = band > 0 && band <= edgeMm ? Math.floor(band / stepMm + 1e-9) : 0;
	const run = input.runMm ?? edgeLengthMm - 2 * startMm;
	const columns = run > 0 ? Math.floor(run / stepMm + 1e-9) : 0;
	if (rows === 0 || columns === 0) {
		warnings.push({
			code: 'border-no-squares',
			message: `No ${fmtMm(stepMm)} squares fit between the first rules and the start marks; make the step smaller or the band wider.`
		});
	}
	if (startMm + columns * stepMm > edgeLengthMm + 1e-9) {
		warnings.push({
			code: 'border-too-long',
			message: 'The squares run past the end of the edge.'
		});
	}
	const gridStart = { x: startMm, y: centre - (rows * stepMm) / 2 };
	const triangles: Point[][] = [];
	for (let i = 0; i < columns; i++) {
		for (let j = 0; j < rows; j++) {
			triangles.push(
				...squareTriangles(
					gridStart.x + i * stepMm,
					gridStart.y + j * stepMm,
					stepMm,
					trianglesPerSquare
				)
			);
		}
	}
	return {
		edgeMm,
		lengthMm: edgeLengthMm,
		rules,
		columns,
		rows,
		gridStart,
		stepMm,
		triangles,
		warnings
	};
}

function squareTriangles(x: number, y: number, s: number, per: 1 | 2 | 4): Point[][] {
	const a = { x, y };
	const b = { x: x + s, y };
	const c = { x: x + s, y: y + s };
	const d = { x, y: y + s };
	if (per === 1) return [[a, c, d]];
	if (per === 2)
		return [
			[a, b, c],
			[a, c, d]
		];
	const m = { x: x + s / 2, y: y + s / 2 };
	return [
		[a, b, m],
		[b, c, m],
		[c, d, m],
		[d, a, m]
	];
}

export function triangleArea([a, b, c]: Point[]): number {
	return Math.abs((b.x - a.x) * (c.y - a.y) - (c.x - a.x) * (b.y - a.y)) / 2;
}

export function trianglePerimeter([a, b, c]: Point[]): number {
	return (
		Math.hypot(b.x - a.x, b.y - a.y) +
		Math.hypot(c.x - b.x, c.y - b.y) +
		Math.hypot(a.x - c.x, a.y - c.y)
	);
}

function fmtMm(n: number) {
	return `${Math.round(n * 10) / 10} mm`;
}
