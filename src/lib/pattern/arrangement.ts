/**
 * The planar arrangement of drawn circular arcs and straight segments, and its faces.
 *
 * Why an arrangement: where rosettes overlap, one rosette's arcs cut the other's chips, and at
 * spacing r many curves coincide exactly (a neighbour's outline is an arc circle of the first).
 * Counting chips per rosette and adding would count the shared regions twice. Instead every
 * drawn curve goes into one arrangement:
 *   1. coincident curves are merged (same circle → union of its drawn angle ranges; same
 *      straight line → union of its drawn stretches), so a shared line is one edge, not two;
 *   2. every crossing and touching point becomes a vertex (points closer than SNAP are one);
 *   3. each curve is split at its vertices into edges; each edge gives two half-edges;
 *   4. at every vertex the outgoing half-edges are sorted by tangent direction, ties (curves that
 *      touch, e.g. the arcs meeting at a rosette's centre) broken by curvature;
 *   5. faces are traced by always taking the next half-edge clockwise; each face's area comes
 *      exactly from Green's theorem with closed-form arc terms, so the faces of a region add up
 *      to its area with no overlap and no gap. Unbounded (outer) faces have negative area and
 *      are dropped.
 * Every drawn curve must touch the rest of the drawing (true for rosettes: all arcs meet the
 * outline), otherwise a floating curve's region would not be subtracted from its surroundings.
 */
import {
	type Circle,
	type Point,
	TAU,
	angleOf,
	arcAreaTerm,
	circleCircle,
	dist,
	lineCircle,
	lineLine,
	normAngle,
	onCircle,
	segmentAreaTerm
} from './geometry';

export type ArcSpec = { kind: 'arc'; c: Circle; from: number; to: number; tag: string };
export type SegSpec = { kind: 'seg'; a: Point; b: Point; tag: string };
export type CurveSpec = ArcSpec | SegSpec;

/** One drawn edge, in the direction a face walks it. `sweep` is signed (arcs only). */
export type Edge =
	| { kind: 'arc'; group: number; from: Point; to: Point; c: Circle; start: number; sweep: number }
	| { kind: 'line'; group: number; from: Point; to: Point };

export type Face = {
	edges: Edge[];
	area: number;
	perimeter: number;
	/** Centroid of a fine polygon through the boundary: a point inside for the chip shapes here. */
	centroid: Point;
	/** The face's sides after joining edges that continue the same curve, in order round. */
	sideKinds: ('arc' | 'line')[];
	/** Tags of the curves that bound the face. */
	tags: Set<string>;
};

export type Arrangement = { faces: Face[]; edges: Edge[]; groupTags: Set<string>[] };

const SNAP = 1e-6;

type CircleGroup = { kind: 'circle'; c: Circle; spans: [number, number][]; full: boolean };
type LineGroup = { kind: 'line'; p: Point; u: Point; spans: [number, number][] };
type Group = (CircleGroup | LineGroup) & { tags: Set<string>; marks: { s: number; v: number }[] };

function unionSpans(spans: [number, number][]): [number, number][] {
	const s = spans.filter(([a, b]) => b - a > 1e-12).sort((p, q) => p[0] - q[0]);
	const out: [number, number][] = [];
	for (const [a, b] of s) {
		const last = out[out.length - 1];
		if (last && a <= last[1] + 1e-12) last[1] = Math.max(last[1], b);
		else out.push([a, b]);
	}
	return out;
}

/** Merge angle ranges on one circle, handling the wrap at 2π. */
function circleSpans(raw: [number, number][]): { spans: [number, number][]; full: boolean } {
	const pieces: [number, number][] = [];
	for (const [from, to] of raw) {
		const sweep = to - from;
		if (sweep >= TAU - 1e-12) return { spans: [[0, TAU]], full: true };
		const a = normAngle(from);
		const b = a + sweep;
		if (b > TAU) pieces.push([a, TAU], [0, b - TAU]);
		else pieces.push([a, b]);
	}
	const u = unionSpans(pieces);
	if (u.length === 1 && u[0][0] <= 1e-12 && u[0][1] >= TAU - 1e-12) {
		return { spans: [[0, TAU]], full: true };
	}
	if (u.length > 1 && u[0][0] <= 1e-12 && u[u.length - 1][1] >= TAU - 1e-12) {
		const first = u.shift()!;
		u[u.length - 1][1] = TAU + first[1];
	}
	return { spans: u, full: false };
}

function buildGroups(curves: CurveSpec[]): Group[] {
	const circles: { c: Circle; raw: [number, number][]; tags: Set<string> }[] = [];
	const lines: { p: Point; u: Point; raw: [number, number][]; tags: Set<string> }[] = [];
	for (const cv of curves) {
		if (cv.kind === 'arc') {
			let g = circles.find(
				(k) =>
					Math.abs(k.c.x - cv.c.x) < SNAP &&
					Math.abs(k.c.y - cv.c.y) < SNAP &&
					Math.abs(k.c.r - cv.c.r) < SNAP
			);
			if (!g) circles.push((g = { c: cv.c, raw: [], tags: new Set() }));
			g.raw.push([cv.from, cv.to]);
			g.tags.add(cv.tag);
		} else {
			const len = dist(cv.a, cv.b);
			if (len < SNAP) continue;
			let u = { x: (cv.b.x - cv.a.x) / len, y: (cv.b.y - cv.a.y) / len };
			// One direction per line, so collinear segments land in the same group.
			if (u.x < -1e-12 || (Math.abs(u.x) <= 1e-12 && u.y < 0)) u = { x: -u.x, y: -u.y };
			const off = -u.y * cv.a.x + u.x * cv.a.y;
			const p = { x: -u.y * off, y: u.x * off };
			let g = lines.find(
				(k) => Math.abs(k.u.x - u.x) < 1e-9 && Math.abs(k.u.y - u.y) < 1e-9 && dist(k.p, p) < SNAP
			);
			if (!g) lines.push((g = { p, u, raw: [], tags: new Set() }));
			const s0 = (cv.a.x - g.p.x) * g.u.x + (cv.a.y - g.p.y) * g.u.y;
			const s1 = (cv.b.x - g.p.x) * g.u.x + (cv.b.y - g.p.y) * g.u.y;
			g.raw.push([Math.min(s0, s1), Math.max(s0, s1)]);
			g.tags.add(cv.tag);
		}
	}
	const groups: Group[] = [];
	for (const k of circles) {
		const { spans, full } = circleSpans(k.raw);
		groups.push({ kind: 'circle', c: k.c, spans, full, tags: k.tags, marks: [] });
	}
	for (const k of lines) {
		groups.push({
			kind: 'line',
			p: k.p,
			u: k.u,
			spans: unionSpans(k.raw),
			tags: k.tags,
			marks: []
		});
	}
	return groups;
}

/** Parameter of point q on the group's curve, when q lies on a drawn part; else null. */
function paramOn(g: Group, q: Point): number | null {
	if (g.kind === 'circle') {
		if (Math.abs(dist(g.c, q) - g.c.r) > 1e-5) return null;
		if (g.full) return normAngle(angleOf(g.c, q));
		const tol = SNAP / g.c.r;
		const a = normAngle(angleOf(g.c, q));
		for (const [f, t] of g.spans) {
			for (const cand of [a, a + TAU]) if (cand >= f - tol && cand <= t + tol) return cand;
		}
		return null;
	}
	const dx = q.x - g.p.x;
	const dy = q.y - g.p.y;
	if (Math.abs(-g.u.y * dx + g.u.x * dy) > 1e-5) return null;
	const s = dx * g.u.x + dy * g.u.y;
	for (const [f, t] of g.spans) if (s >= f - SNAP && s <= t + SNAP) return s;
	return null;
}

function pointAt(g: Group, s: number): Point {
	return g.kind === 'circle' ? onCircle(g.c, s) : { x: g.p.x + g.u.x * s, y: g.p.y + g.u.y * s };
}

function crossings(a: Group, b: Group): Point[] {
	if (a.kind === 'circle' && b.kind === 'circle') return circleCircle(a.c, b.c);
	if (a.kind === 'line' && b.kind === 'line') {
		const st = lineLine(a.p, a.u, b.p, b.u);
		return st ? [pointAt(a, st[0])] : [];
	}
	const [l, c] = a.kind === 'line' ? [a, b as CircleGroup] : [b as LineGroup, a as CircleGroup];
	return lineCircle(l.p, l.u, c.c).map((s) => ({ x: l.p.x + l.u.x * s, y: l.p.y + l.u.y * s }));
}

class Vertices {
	points: Point[] = [];
	private grid = new Map<string, number[]>();
	id(q: Point): number {
		const cx = Math.round(q.x / 1e-4);
		const cy = Math.round(q.y / 1e-4);
		for (let i = -1; i <= 1; i++)
			for (let j = -1; j <= 1; j++) {
				for (const v of this.grid.get(`${cx + i},${cy + j}`) ?? []) {
					if (dist(this.points[v], q) < SNAP) return v;
				}
			}
		const v = this.points.length;
		this.points.push(q);
		const key = `${cx},${cy}`;
		const list = this.grid.get(key);
		if (list) list.push(v);
		else this.grid.set(key, [v]);
		return v;
	}
}

type Half = {
	edge: number;
	dir: 1 | -1;
	origin: number;
	dest: number;
	angle: number;
	curvature: number;
	twin: number;
	used: boolean;
};

type RawEdge = { group: number; s0: number; s1: number; v0: number; v1: number };

function tangent(g: Group, s: number, dir: 1 | -1): { angle: number; curvature: number } {
	let tx: number;
	let ty: number;
	let k = 0;
	if (g.kind === 'circle') {
		tx = -Math.sin(s) * dir;
		ty = Math.cos(s) * dir;
		k = dir / g.c.r;
	} else {
		tx = g.u.x * dir;
		ty = g.u.y * dir;
	}
	let angle = normAngle(Math.atan2(ty, tx));
	if (angle > TAU - 1e-9) angle = 0;
	return { angle, curvature: k };
}

function splitIntoEdges(groups: Group[], verts: Vertices): RawEdge[] {
	const out: RawEdge[] = [];
	groups.forEach((g, gi) => {
		const marks = g.marks;
		if (g.kind === 'circle' && g.full) {
			if (marks.length === 0) marks.push({ s: 0, v: verts.id(onCircle(g.c, 0)) });
			const ms = dedupeMarks(marks.map((m) => ({ s: normAngle(m.s), v: m.v })));
			for (let i = 0; i < ms.length; i++) {
				const a = ms[i];
				const b = i + 1 < ms.length ? ms[i + 1] : { s: ms[0].s + TAU, v: ms[0].v };
				out.push({ group: gi, s0: a.s, s1: b.s, v0: a.v, v1: b.v });
			}
			return;
		}
		for (const [f, t] of g.spans) {
			const tol = g.kind === 'circle' ? SNAP / g.c.r : SNAP;
			const inSpan: { s: number; v: number }[] = [];
			for (const m of marks) {
				const cands = g.kind === 'circle' ? [m.s, m.s + TAU, m.s - TAU] : [m.s];
				for (const s of cands) if (s >= f - tol && s <= t + tol) inSpan.push({ s, v: m.v });
			}
			const ms = dedupeMarks(inSpan);
			for (let i = 0; i + 1 < ms.length; i++) {
				if (ms[i + 1].s - ms[i].s < 1e-12) continue;
				out.push({ group: gi, s0: ms[i].s, s1: ms[i + 1].s, v0: ms[i].v, v1: ms[i + 1].v });
			}
		}
	});
	return out;
}

function dedupeMarks(ms: { s: number; v: number }[]) {
	ms.sort((a, b) => a.s - b.s);
	return ms.filter((m, i) => i === 0 || m.v !== ms[i - 1].v || m.s - ms[i - 1].s > 1e-9);
}

function edgeGeometry(g: Group, e: RawEdge, dir: 1 | -1, gi: number, verts: Vertices): Edge {
	const from = verts.points[dir === 1 ? e.v0 : e.v1];
	const to = verts.points[dir === 1 ? e.v1 : e.v0];
	if (g.kind === 'circle') {
		const start = dir === 1 ? e.s0 : e.s1;
		return { kind: 'arc', group: gi, from, to, c: g.c, start, sweep: (e.s1 - e.s0) * dir };
	}
	return { kind: 'line', group: gi, from, to };
}

export function edgeLength(e: Edge): number {
	return e.kind === 'arc' ? Math.abs(e.sweep) * e.c.r : dist(e.from, e.to);
}

function edgeAreaTerm(e: Edge): number {
	return e.kind === 'arc'
		? arcAreaTerm(e.c, e.start, e.start + e.sweep)
		: segmentAreaTerm(e.from, e.to);
}

/** Points along an edge, excluding its end, for polygon approximations. */
export function sampleEdge(e: Edge, stepRad = Math.PI / 24): Point[] {
	if (e.kind === 'line') return [e.from];
	const n = Math.max(2, Math.ceil(Math.abs(e.sweep) / stepRad));
	const pts: Point[] = [];
	for (let i = 0; i < n; i++) pts.push(onCircle(e.c, e.start + (e.sweep * i) / n));
	return pts;
}

function polygonCentroid(pts: Point[]): Point {
	let a = 0;
	let cx = 0;
	let cy = 0;
	for (let i = 0; i < pts.length; i++) {
		const p = pts[i];
		const q = pts[(i + 1) % pts.length];
		const cr = p.x * q.y - q.x * p.y;
		a += cr;
		cx += (p.x + q.x) * cr;
		cy += (p.y + q.y) * cr;
	}
	return Math.abs(a) < 1e-15 ? pts[0] : { x: cx / (3 * a), y: cy / (3 * a) };
}

export function buildArrangement(curves: CurveSpec[]): Arrangement {
	const groups = buildGroups(curves);
	const verts = new Vertices();
	const mark = (gi: number, q: Point) => {
		const s = paramOn(groups[gi], q);
		if (s !== null) groups[gi].marks.push({ s, v: verts.id(q) });
	};
	// Ends of drawn parts, and any other curve they touch (T-junctions).
	groups.forEach((g) => {
		if (g.kind === 'circle' && g.full) return;
		for (const [f, t] of g.spans) {
			for (const q of [pointAt(g, f), pointAt(g, t)]) {
				for (let gj = 0; gj < groups.length; gj++) mark(gj, q);
			}
		}
	});
	for (let i = 0; i < groups.length; i++) {
		for (let j = i + 1; j < groups.length; j++) {
			for (const q of crossings(groups[i], groups[j])) {
				const si = paramOn(groups[i], q);
				if (si === null) continue;
				const sj = paramOn(groups[j], q);
				if (sj === null) continue;
				const v = verts.id(q);
				groups[i].marks.push({ s: si, v });
				groups[j].marks.push({ s: sj, v });
			}
		}
	}

	const raw = splitIntoEdges(groups, verts);
	const halves: Half[] = [];
	raw.forEach((e, ei) => {
		const g = groups[e.group];
		const t0 = tangent(g, e.s0, 1);
		const t1 = tangent(g, e.s1, -1);
		const h0 = halves.length;
		halves.push({ edge: ei, dir: 1, origin: e.v0, dest: e.v1, ...t0, twin: h0 + 1, used: false });
		halves.push({ edge: ei, dir: -1, origin: e.v1, dest: e.v0, ...t1, twin: h0, used: false });
	});
	const around: number[][] = verts.points.map(() => []);
	halves.forEach((h, hi) => around[h.origin].push(hi));
	const position = new Array<number>(halves.length);
	for (const list of around) {
		list.sort((a, b) => {
			const ha = halves[a];
			const hb = halves[b];
			const d = ha.angle - hb.angle;
			if (Math.abs(d) > 1e-9) return d;
			return ha.curvature - hb.curvature;
		});
		list.forEach((h, i) => (position[h] = i));
	}

	const faces: Face[] = [];
	for (let start = 0; start < halves.length; start++) {
		if (halves[start].used) continue;
		const loop: number[] = [];
		let h = start;
		let guard = 0;
		while (!halves[h].used && guard++ < halves.length) {
			halves[h].used = true;
			loop.push(h);
			const twin = halves[h].twin;
			const list = around[halves[h].dest];
			h = list[(position[twin] - 1 + list.length) % list.length];
		}
		const edges = loop.map((hi) => {
			const hh = halves[hi];
			return edgeGeometry(
				groups[raw[hh.edge].group],
				raw[hh.edge],
				hh.dir,
				raw[hh.edge].group,
				verts
			);
		});
		const area = edges.reduce((s, e) => s + edgeAreaTerm(e), 0);
		if (area <= 1e-9) continue; // unbounded face of a connected part
		const tags = new Set<string>();
		for (const e of edges) for (const t of groups[e.group].tags) tags.add(t);
		faces.push({
			edges,
			area,
			perimeter: edges.reduce((s, e) => s + edgeLength(e), 0),
			centroid: polygonCentroid(edges.flatMap((e) => sampleEdge(e))),
			sideKinds: sidesOf(edges),
			tags
		});
	}
	const edges = raw.map((e, ei) => edgeGeometry(groups[e.group], e, 1, raw[ei].group, verts));
	return { faces, edges, groupTags: groups.map((g) => g.tags) };
}

/** Runs of the same curve round a closed loop: a lens has two sides, however many vertices. */
function sidesOf(edges: Edge[]): ('arc' | 'line')[] {
	const n = edges.length;
	const kinds: ('arc' | 'line')[] = [];
	for (let i = 0; i < n; i++) {
		if (edges[i].group !== edges[(i - 1 + n) % n].group) kinds.push(edges[i].kind);
	}
	return kinds.length === 0 && n > 0 ? [edges[0].kind] : kinds;
}
