/**
 * Halved chips: each chip is split along its own axis, as a carver does for finer work.
 * The axis is found per chip of the finished arrangement (not ruled right across each rosette),
 * so where rosettes overlap a shared chip is halved once, along its own middle:
 *   - a lens (petal): the straight line between its two tips;
 *   - a curved triangle (between-petal chip): from its pointed corner (where two arcs meet
 *     tangent, at a rosette centre) to the middle of the opposite side;
 *   - a chip the medallion cuts: the rosette's own axis through it, from the medallion line out.
 * Other shapes are left whole.
 */
import type { Edge, Face, SegSpec } from './arrangement';
import { type Circle, type Point, angleOf, dist, lineCircle, lineLine, onCircle } from './geometry';
import type { RosetteGeometry } from './rosette';

function runs(edges: Edge[]): Edge[][] {
	const n = edges.length;
	let start = 0;
	while (start < n && edges[start].group === edges[(start - 1 + n) % n].group) start++;
	if (start === n) return [edges];
	const out: Edge[][] = [];
	for (let i = 0; i < n; i++) {
		const e = edges[(start + i) % n];
		const last = out[out.length - 1];
		if (last && last[last.length - 1].group === e.group) last.push(e);
		else out.push([e]);
	}
	return out;
}

function dirAt(e: Edge, atEnd: boolean): Point {
	if (e.kind === 'line') {
		const l = dist(e.from, e.to) || 1;
		return { x: (e.to.x - e.from.x) / l, y: (e.to.y - e.from.y) / l };
	}
	const t = atEnd ? e.start + e.sweep : e.start;
	const s = Math.sign(e.sweep);
	return { x: -Math.sin(t) * s, y: Math.cos(t) * s };
}

function runMiddle(run: Edge[]): Point {
	const first = run[0];
	if (first.kind === 'arc') {
		const sweep = run.reduce((s, e) => s + (e.kind === 'arc' ? e.sweep : 0), 0);
		return onCircle(first.c, first.start + sweep / 2);
	}
	const last = run[run.length - 1];
	return { x: (first.from.x + last.to.x) / 2, y: (first.from.y + last.to.y) / 2 };
}

export function axisOf(
	face: Face,
	medallion: Circle | null,
	home: RosetteGeometry | null
): SegSpec | null {
	if (medallion && home && face.tags.has('medallion')) return medallionAxis(face, medallion, home);
	const sides = runs(face.edges);
	if (sides.some((s) => s[0].kind !== 'arc')) return null;
	if (sides.length === 2)
		return { kind: 'seg', a: sides[0][0].from, b: sides[1][0].from, tag: 'axis' };
	if (sides.length === 3) {
		// The pointed corner: where the boundary turns right back on itself.
		let best = 0;
		let bestDot = Infinity;
		for (let k = 0; k < 3; k++) {
			const incoming = dirAt(sides[k][sides[k].length - 1], true);
			const outgoing = dirAt(sides[(k + 1) % 3][0], false);
			const dot = incoming.x * outgoing.x + incoming.y * outgoing.y;
			if (dot < bestDot) {
				bestDot = dot;
				best = k;
			}
		}
		if (bestDot > -0.99) return null; // no pointed corner: not a between-petal chip
		const corner = sides[(best + 1) % 3][0].from;
		return { kind: 'seg', a: corner, b: runMiddle(sides[(best + 2) % 3]), tag: 'axis' };
	}
	return null;
}

function medallionAxis(face: Face, m: Circle, g: RosetteGeometry): SegSpec | null {
	const a = angleOf(g.circle, face.centroid);
	const targets = [...g.marks, ...g.midEdges];
	let best: Point | null = null;
	let bestGap = Infinity;
	for (const p of targets) {
		const gap = Math.abs(
			Math.atan2(Math.sin(angleOf(g.circle, p) - a), Math.cos(angleOf(g.circle, p) - a))
		);
		if (gap < bestGap) {
			bestGap = gap;
			best = p;
		}
	}
	if (!best) return null;
	const dir = angleOf(g.circle, best);
	const a0 = onCircle(m, dir);
	const end = rayExit(face, a0, { x: Math.cos(dir), y: Math.sin(dir) });
	return end ? { kind: 'seg', a: a0, b: end, tag: 'axis' } : null;
}

/** Where a ray from a point on the boundary first leaves the face again. */
function rayExit(face: Face, p: Point, u: Point): Point | null {
	let bestS = Infinity;
	for (const e of face.edges) {
		if (e.kind === 'line') {
			const l = dist(e.from, e.to);
			const v = { x: (e.to.x - e.from.x) / l, y: (e.to.y - e.from.y) / l };
			const st = lineLine(p, u, e.from, v);
			if (st && st[0] > 1e-6 && st[1] >= -1e-9 && st[1] <= l + 1e-9) bestS = Math.min(bestS, st[0]);
			continue;
		}
		for (const s of lineCircle(p, u, e.c)) {
			if (s <= 1e-6) continue;
			const q = { x: p.x + u.x * s, y: p.y + u.y * s };
			if (onArc(e, q)) bestS = Math.min(bestS, s);
		}
	}
	return isFinite(bestS) ? { x: p.x + u.x * bestS, y: p.y + u.y * bestS } : null;
}

function onArc(e: Extract<Edge, { kind: 'arc' }>, q: Point): boolean {
	const t = angleOf(e.c, q);
	const lo = Math.min(e.start, e.start + e.sweep);
	const span = Math.abs(e.sweep);
	const rel = (((t - lo) % (2 * Math.PI)) + 2 * Math.PI) % (2 * Math.PI);
	return rel <= span + 1e-9 || rel >= 2 * Math.PI - 1e-9;
}
