/**
 * Plane geometry primitives for the layout engine. Millimetres; x across, y down (the same
 * orientation as SVG), angles in radians measured with atan2(y, x), so an increasing angle runs
 * clockwise on screen — which is SVG's sweep-flag 1.
 */
export type Point = { x: number; y: number };
export type Circle = { x: number; y: number; r: number };

export const TAU = 2 * Math.PI;
/** Tolerance for "the same point" in mm: far below anything a pencil can draw. */
export const EPS = 1e-7;

export const pt = (x: number, y: number): Point => ({ x, y });
export const dist = (a: Point, b: Point) => Math.hypot(a.x - b.x, a.y - b.y);
export const onCircle = (c: Circle, angle: number): Point => ({
	x: c.x + c.r * Math.cos(angle),
	y: c.y + c.r * Math.sin(angle)
});
export const angleOf = (c: Point, p: Point) => Math.atan2(p.y - c.y, p.x - c.x);

/** Angle folded into [0, 2π). */
export function normAngle(a: number): number {
	const t = a % TAU;
	return t < 0 ? t + TAU : t;
}

/** Where two circles meet: 0, 1 (touching) or 2 points. Identical circles give none. */
export function circleCircle(a: Circle, b: Circle, eps = 1e-9): Point[] {
	const d = Math.hypot(b.x - a.x, b.y - a.y);
	if (d < eps) return [];
	if (d > a.r + b.r + eps || d < Math.abs(a.r - b.r) - eps) return [];
	// Distance from a's centre to the chord, along the line of centres.
	const along = (d * d + a.r * a.r - b.r * b.r) / (2 * d);
	const h2 = a.r * a.r - along * along;
	const ux = (b.x - a.x) / d;
	const uy = (b.y - a.y) / d;
	const mx = a.x + ux * along;
	const my = a.y + uy * along;
	// Touching circles: floating error may open a hair-thin gap or overlap; call it one point.
	if (h2 <= 1e-10) return [{ x: mx, y: my }];
	const h = Math.sqrt(h2);
	return [
		{ x: mx - uy * h, y: my + ux * h },
		{ x: mx + uy * h, y: my - ux * h }
	];
}

/**
 * Where the line p + s·u (u a unit vector) meets a circle: the parameters s, ascending.
 */
export function lineCircle(p: Point, u: Point, c: Circle, eps = 1e-9): number[] {
	const fx = p.x - c.x;
	const fy = p.y - c.y;
	const b = fx * u.x + fy * u.y;
	const cc = fx * fx + fy * fy - c.r * c.r;
	const disc = b * b - cc;
	if (disc < -eps) return [];
	if (disc <= 1e-10) return [-b]; // touching (see circleCircle)
	const s = Math.sqrt(disc);
	return [-b - s, -b + s];
}

/** Where two lines p + s·u and q + t·v cross: [s, t], or null when parallel. */
export function lineLine(p: Point, u: Point, q: Point, v: Point): [number, number] | null {
	const den = u.x * v.y - u.y * v.x;
	if (Math.abs(den) < 1e-12) return null;
	const wx = q.x - p.x;
	const wy = q.y - p.y;
	return [(wx * v.y - wy * v.x) / den, (wx * u.y - wy * u.x) / den];
}

/**
 * Area of the lens shared by two circles of equal radius r whose centres are d apart:
 * 2r²·acos(d/2r) − (d/2)·√(4r² − d²).
 */
export function lensArea(r: number, d: number): number {
	if (d >= 2 * r) return 0;
	return 2 * r * r * Math.acos(d / (2 * r)) - (d / 2) * Math.sqrt(4 * r * r - d * d);
}

/**
 * Signed area swept by the chord-to-origin of a circular arc from angle a to b (b < a for the
 * other direction): the arc's term in Green's theorem, ½∮(x dy − y dx).
 */
export function arcAreaTerm(c: Circle, a: number, b: number): number {
	return (
		0.5 *
		(c.r * (c.x * (Math.sin(b) - Math.sin(a)) - c.y * (Math.cos(b) - Math.cos(a))) +
			c.r * c.r * (b - a))
	);
}

/** The straight edge's term in Green's theorem. */
export function segmentAreaTerm(a: Point, b: Point): number {
	return 0.5 * (a.x * b.y - b.x * a.y);
}

/** Short number for SVG and steps: at most 3 decimals, no trailing zeros. */
export function fmt(n: number, digits = 3): string {
	const s = n.toFixed(digits);
	return s.includes('.') ? s.replace(/0+$/, '').replace(/\.$/, '') : s;
}
