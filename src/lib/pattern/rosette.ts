/**
 * The six-petal rosette, built the way a carver lays it out with compass and rule:
 * circle of radius r; step the radius six times round from where the circle crosses the centre
 * line; from each mark an arc of radius r from edge to edge through the centre.
 */
import type { CurveSpec } from './arrangement';
import { type Circle, type Point, TAU, angleOf, circleCircle, dist, onCircle } from './geometry';

/**
 * Step the compass (opening r) round the circle from `start`, as on paper: each new mark is
 * where a circle of radius r about the last mark cuts the rosette circle, going the same way
 * round. Returns the seven marks; the seventh should land on the first.
 */
export function stepRound(c: Circle, start: Point): Point[] {
	const marks = [start];
	for (let i = 0; i < 6; i++) {
		const last = marks[marks.length - 1];
		const hits = circleCircle(c, { x: last.x, y: last.y, r: c.r });
		const a = angleOf(c, last);
		// Take the hit reached by turning the positive way (clockwise on screen).
		const ahead = (p: Point) => (((angleOf(c, p) - a) % TAU) + TAU) % TAU;
		hits.sort((p, q) => ahead(p) - ahead(q));
		marks.push(hits[0]);
	}
	return marks;
}

export type RosetteGeometry = {
	circle: Circle;
	/** The six marks, the first on the centre line towards the top end. */
	marks: Point[];
	/** The middle of each outer edge between neighbouring marks (for halving). */
	midEdges: Point[];
};

export function rosetteAt(x: number, y: number, r: number): RosetteGeometry {
	const circle = { x, y, r };
	const marks = stepRound(circle, { x, y: y - r }).slice(0, 6);
	const midEdges = marks.map((_, k) =>
		onCircle(circle, -Math.PI / 2 + Math.PI / 6 + (k * Math.PI) / 3)
	);
	return { circle, marks, midEdges };
}

/**
 * The curves a rosette adds to the drawing: its outline and six 120° arcs through the centre,
 * each from the mark before to the mark after. (Halving lines are added per chip: split.ts.)
 */
export function rosetteCurves(g: RosetteGeometry, index: number): CurveSpec[] {
	const { circle: c, marks } = g;
	const curves: CurveSpec[] = [{ kind: 'arc', c, from: 0, to: TAU, tag: `outline:${index}` }];
	for (const m of marks) {
		const towardCentre = angleOf(m, c);
		curves.push({
			kind: 'arc',
			c: { x: m.x, y: m.y, r: c.r },
			from: towardCentre - Math.PI / 3,
			to: towardCentre + Math.PI / 3,
			tag: `arc:${index}`
		});
	}
	return curves;
}

/** Which chip of this rosette holds point p: petal j is the lens of the arcs about marks j±1. */
export function chipKindAt(g: RosetteGeometry, p: Point): 'petal' | 'between' | null {
	const { circle: c, marks } = g;
	if (dist(c, p) >= c.r) return null;
	for (let j = 0; j < 6; j++) {
		const a = marks[(j + 5) % 6];
		const b = marks[(j + 1) % 6];
		if (dist(a, p) < c.r && dist(b, p) < c.r) return 'petal';
	}
	return 'between';
}
