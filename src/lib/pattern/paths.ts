/** SVG path data for arrangement edges and faces (mm, y down). */
import type { Edge } from './arrangement';
import { fmt, onCircle } from './geometry';

/** The drawing command that walks an edge from its start (the pen is already there). */
export function edgeCommand(e: Edge): string {
	if (e.kind === 'line') return `L${fmt(e.to.x)} ${fmt(e.to.y)}`;
	const r = fmt(e.c.r);
	const sweepFlag = e.sweep > 0 ? 1 : 0;
	// A whole circle cannot be one SVG arc: go half way first.
	if (Math.abs(e.sweep) > Math.PI * 1.999) {
		const mid = onCircle(e.c, e.start + e.sweep / 2);
		return `A${r} ${r} 0 0 ${sweepFlag} ${fmt(mid.x)} ${fmt(mid.y)}A${r} ${r} 0 0 ${sweepFlag} ${fmt(e.to.x)} ${fmt(e.to.y)}`;
	}
	const large = Math.abs(e.sweep) > Math.PI ? 1 : 0;
	return `A${r} ${r} 0 ${large} ${sweepFlag} ${fmt(e.to.x)} ${fmt(e.to.y)}`;
}

export function facePath(edges: Edge[]): string {
	if (edges.length === 0) return '';
	return `M${fmt(edges[0].from.x)} ${fmt(edges[0].from.y)}${edges.map(edgeCommand).join('')}Z`;
}

/** Every edge as its own stroke, for the line drawing. */
export function edgesPath(edges: Edge[]): string {
	return edges.map((e) => `M${fmt(e.from.x)} ${fmt(e.from.y)}${edgeCommand(e)}`).join('');
}
