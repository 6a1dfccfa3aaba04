/** Remove the parts of drawn curves that fall inside a disc (the plain medallion). */
import type { CurveSpec } from './arrangement';
import { type Circle, angleOf, circleCircle, dist, lineCircle, onCircle } from './geometry';

export function clipOutsideDisc(curves: CurveSpec[], disc: Circle): CurveSpec[] {
	const out: CurveSpec[] = [];
	const outside = (x: number, y: number) => Math.hypot(x - disc.x, y - disc.y) > disc.r;
	for (const cv of curves) {
		if (cv.kind === 'arc') {
			const cuts = circleCircle(cv.c, disc).map((p) => {
				let a = angleOf(cv.c, p);
				while (a < cv.from) a += 2 * Math.PI;
				while (a >= cv.from + 2 * Math.PI) a -= 2 * Math.PI;
				return a;
			});
			const stops = [cv.from, ...cuts.filter((a) => a < cv.to), cv.to].sort((p, q) => p - q);
			for (let i = 0; i + 1 < stops.length; i++) {
				const m = onCircle(cv.c, (stops[i] + stops[i + 1]) / 2);
				if (stops[i + 1] - stops[i] > 1e-12 && outside(m.x, m.y)) {
					out.push({ ...cv, from: stops[i], to: stops[i + 1] });
				}
			}
		} else {
			const len = dist(cv.a, cv.b);
			if (len === 0) continue;
			const u = { x: (cv.b.x - cv.a.x) / len, y: (cv.b.y - cv.a.y) / len };
			const cuts = lineCircle(cv.a, u, disc).filter((s) => s > 0 && s < len);
			const stops = [0, ...cuts, len];
			for (let i = 0; i + 1 < stops.length; i++) {
				const s = (stops[i] + stops[i + 1]) / 2;
				if (stops[i + 1] - stops[i] > 1e-9 && outside(cv.a.x + u.x * s, cv.a.y + u.y * s)) {
					const at = (t: number) => ({ x: cv.a.x + u.x * t, y: cv.a.y + u.y * t });
					out.push({ ...cv, a: at(stops[i]), b: at(stops[i + 1]) });
				}
			}
		}
	}
	return out;
}
