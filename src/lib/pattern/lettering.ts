/**
 * Initials in a plain medallion at the centre of a rosette, at the largest cap height that fits.
 * The outlines come through a small GlyphSource interface, so this file needs no font library
 * and no I/O: callers hand over letterFont() from letter-font.ts, built from generated data.
 */
import type { Circle, Point } from './geometry';
import { fmt } from './geometry';

export type PathCommand =
	| { type: 'M' | 'L'; x: number; y: number }
	| { type: 'Q'; x1: number; y1: number; x: number; y: number }
	| { type: 'C'; x1: number; y1: number; x2: number; y2: number; x: number; y: number }
	| { type: 'Z' };

/** Outlines in font units, y down, baseline at y = 0, the pen starting at x = 0. */
export type GlyphSource = {
	unitsPerEm: number;
	capHeight: number;
	outline(text: string): { commands: PathCommand[] }[];
};

export type LetteringRules = {
	/** Medallion radius as a share of the rosette radius. */
	medallionRatio: number;
	/** Clear wood between the letters' outer corners and the medallion line. */
	marginMm: number;
	/**
	 * Smallest cap height worth carving. Default 6 mm: common practice (letters much smaller
	 * than this crumble between two knife cuts in soft wood).
	 */
	minCapHeightMm: number;
	/**
	 * Thinnest stroke worth carving. Default 1.2 mm: common practice (a V-cut needs room for
	 * two walls meeting at the bottom).
	 */
	minStrokeMm: number;
};

export const LETTERING_DEFAULTS: LetteringRules = {
	medallionRatio: 0.42,
	marginMm: 2,
	minCapHeightMm: 6,
	minStrokeMm: 1.2
};

export type LetterShape = {
	char: string;
	d: string;
	areaMm2: number;
	outlineMm: number;
	strokeMm: number;
};

export type Lettering = {
	text: string;
	medallion: Circle;
	capHeightMm: number;
	/** Outlines in mm; empty when no font was given (the SVG then falls back to text). */
	letters: LetterShape[];
	/** Baseline position for the text fallback. */
	baseline: Point;
	warnings: { code: string; message: string }[];
};

/** Flatten one glyph's commands into closed polygons. */
export function flatten(commands: PathCommand[], steps = 8): Point[][] {
	const rings: Point[][] = [];
	let ring: Point[] = [];
	let cur: Point = { x: 0, y: 0 };
	for (const c of commands) {
		if (c.type === 'M') {
			if (ring.length > 2) rings.push(ring);
			ring = [{ x: c.x, y: c.y }];
			cur = { x: c.x, y: c.y };
		} else if (c.type === 'L') {
			ring.push((cur = { x: c.x, y: c.y }));
		} else if (c.type === 'Q') {
			const p0 = cur;
			for (let i = 1; i <= steps; i++) {
				const t = i / steps;
				const m = 1 - t;
				ring.push({
					x: m * m * p0.x + 2 * m * t * c.x1 + t * t * c.x,
					y: m * m * p0.y + 2 * m * t * c.y1 + t * t * c.y
				});
			}
			cur = { x: c.x, y: c.y };
		} else if (c.type === 'C') {
			const p0 = cur;
			for (let i = 1; i <= steps; i++) {
				const t = i / steps;
				const m = 1 - t;
				ring.push({
					x: m * m * m * p0.x + 3 * m * m * t * c.x1 + 3 * m * t * t * c.x2 + t * t * t * c.x,
					y: m * m * m * p0.y + 3 * m * m * t * c.y1 + 3 * m * t * t * c.y2 + t * t * t * c.y
				});
			}
			cur = { x: c.x, y: c.y };
		} else if (c.type === 'Z') {
			if (ring.length > 2) rings.push(ring);
			ring = [];
		}
	}
	if (ring.length > 2) rings.push(ring);
	return rings;
}

function ringArea(r: Point[]): number {
	let a = 0;
	for (let i = 0; i < r.length; i++) {
		const p = r[i];
		const q = r[(i + 1) % r.length];
		a += p.x * q.y - q.x * p.y;
	}
	return a / 2;
}

function ringLength(r: Point[]): number {
	let l = 0;
	for (let i = 0; i < r.length; i++) {
		const q = r[(i + 1) % r.length];
		l += Math.hypot(q.x - r[i].x, q.y - r[i].y);
	}
	return l;
}

function pathData(commands: PathCommand[], s: number, ox: number, oy: number): string {
	const X = (x: number) => fmt(ox + x * s, 3);
	const Y = (y: number) => fmt(oy + y * s, 3);
	let d = '';
	for (const c of commands) {
		if (c.type === 'M' || c.type === 'L') d += `${c.type}${X(c.x)} ${Y(c.y)}`;
		else if (c.type === 'Q') d += `Q${X(c.x1)} ${Y(c.y1)} ${X(c.x)} ${Y(c.y)}`;
		else if (c.type === 'C')
			d += `C${X(c.x1)} ${Y(c.y1)} ${X(c.x2)} ${Y(c.y2)} ${X(c.x)} ${Y(c.y)}`;
		else d += 'Z';
	}
	return d;
}

/** Rough shape of a capital in Nunito, used only when no font is at hand. */
const FALLBACK = { capEm: 0.705, widthEm: 0.7, strokeEm: 0.13 };

export function setInitials(
	text: string,
	rosette: Circle,
	font: GlyphSource | null | undefined,
	rules: LetteringRules
): Lettering {
	const medallion = { x: rosette.x, y: rosette.y, r: rosette.r * rules.medallionRatio };
	const inner = Math.max(0, medallion.r - rules.marginMm);
	const warnings: Lettering['warnings'] = [];
	let capHeightMm: number;
	let letters: LetterShape[] = [];
	let baseline: Point;

	if (font) {
		const glyphs = font
			.outline(text)
			.map((g, i) => ({ char: text[i] ?? '', commands: g.commands, rings: flatten(g.commands) }));
		let minX = Infinity,
			minY = Infinity,
			maxX = -Infinity,
			maxY = -Infinity;
		for (const g of glyphs)
			for (const r of g.rings)
				for (const p of r) {
					minX = Math.min(minX, p.x);
					maxX = Math.max(maxX, p.x);
					minY = Math.min(minY, p.y);
					maxY = Math.max(maxY, p.y);
				}
		if (!isFinite(minX))
			return { text, medallion, capHeightMm: 0, letters: [], baseline: medallion, warnings };
		const w = maxX - minX;
		const h = maxY - minY;
		// The ink box's corners touch the inner circle: the largest size that fits.
		const s = (2 * inner) / Math.hypot(w, h);
		capHeightMm = font.capHeight * s;
		const ox = medallion.x - ((minX + maxX) / 2) * s;
		const oy = medallion.y - ((minY + maxY) / 2) * s;
		baseline = { x: medallion.x, y: oy };
		letters = glyphs.map((g) => {
			const area = Math.abs(g.rings.reduce((a, r) => a + ringArea(r), 0)) * s * s;
			const outline = g.rings.reduce((a, r) => a + ringLength(r), 0) * s;
			return {
				char: g.char,
				d: pathData(g.commands, s, ox, oy),
				areaMm2: area,
				outlineMm: outline,
				// A stroke of width w and length L has area ≈ w·L and outline ≈ 2L.
				strokeMm: outline > 0 ? (2 * area) / outline : 0
			};
		});
	} else {
		const n = Math.max(1, text.length);
		const w = FALLBACK.widthEm * n;
		const em = (2 * inner) / Math.hypot(w, FALLBACK.capEm);
		capHeightMm = FALLBACK.capEm * em;
		baseline = { x: medallion.x, y: medallion.y + capHeightMm / 2 };
	}

	const stroke = letters.length
		? Math.min(...letters.map((l) => l.strokeMm))
		: (capHeightMm / FALLBACK.capEm) * FALLBACK.strokeEm;
	if (capHeightMm < rules.minCapHeightMm) {
		warnings.push({
			code: 'letters-small',
			message: `The initials come out ${fmt(capHeightMm, 1)} mm tall, under the ${fmt(rules.minCapHeightMm, 1)} mm that carves cleanly: use fewer letters or a larger rosette.`
		});
	}
	if (stroke < rules.minStrokeMm) {
		warnings.push({
			code: 'strokes-thin',
			message: `The letter strokes are about ${fmt(stroke, 1)} mm wide, under the ${fmt(rules.minStrokeMm, 1)} mm a knife can cut cleanly.`
		});
	}
	return { text, medallion, capHeightMm, letters, baseline, warnings };
}
