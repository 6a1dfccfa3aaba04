/** The layout, in the order a carver draws it, in plain words. */
import { fmt } from './geometry';
import type { PatternInput, PatternResult } from './types';

const mm = (n: number) => `${fmt(n, 1)} mm`;

export function layoutSteps(input: PatternInput, res: PatternResult, woodName: string): string[] {
	const steps: string[] = [];
	const { widthMm: w, lengthMm: l } = input;
	const r = res.compassRadiusMm;
	const n = res.rosettes.length;
	const spacing = input.spacingMm ?? r;
	steps.push(
		`Check the blank is ${mm(w)} wide and ${mm(l)} long${input.curvedTop ? ', with the top end rounded across its full width' : ''}. Draw the centre line down its length, ${mm(w / 2)} from either long edge.`
	);
	const first = res.rosettes[0];
	if (n === 1) {
		steps.push(`Mark the centre on the centre line, ${mm(first.y)} from the top end.`);
	} else {
		steps.push(
			`Mark the first centre on the centre line, ${mm(first.y)} from the top end, then ${n - 1} more, each ${mm(spacing)} further down (the last ${mm(res.rosettes[n - 1].y)} from the top end).`
		);
	}
	steps.push(
		`Set the compass to ${mm(r)} — the radius of the ${mm(2 * r)} rosette — and draw ${n === 1 ? 'the circle' : `a circle round each centre`}.`
	);
	steps.push(
		`On each circle put the compass point where the circle crosses the centre line and step round: six marks, the sixth lands back on the first.`
	);
	steps.push(
		`From each mark draw an arc of the same radius from edge to edge through the centre: six petals and six chips between them.`
	);
	if (n > 1 && Math.abs(spacing - r) < 1e-6) {
		steps.push(
			`Where the circles overlap, the arcs fall on each other's lines: draw each line once.`
		);
	}
	if (input.split) {
		steps.push(
			`Halve every chip along its middle: rule a line from each centre to every mark and to the middle of every outer edge.`
		);
	}
	const lt = res.drawing.lettering;
	if (lt) {
		steps.push(
			`In rosette ${(input.initialsOn ?? Math.floor((n - 1) / 2)) + 1} draw the medallion, a ${mm(2 * lt.medallion.r)} circle about the centre, and rub out the lines inside it. Trace the initials ${lt.text} centred in it at ${mm(lt.capHeightMm)} cap height.`
		);
	}
	const b = res.drawing.border;
	if (b) {
		const offs = b.rules.slice(1).map((v) => mm(Math.abs(v - b.edgeMm / 2)));
		const uniq = [...new Set(offs)];
		steps.push(
			`On the ${mm(b.edgeMm)} edge rule the centre line at ${mm(b.edgeMm / 2)}${uniq.length ? `, then lines ${uniq.join(', ')} either side of it` : ''}.`
		);
		if (b.columns > 0 && b.rows > 0) {
			const tri = b.triangles.length / (b.columns * b.rows);
			steps.push(
				`From a start mark ${mm(b.gridStart.x)} from the end, mark ${b.columns} steps of ${mm(b.stepMm)} along the band and ${b.rows} across; draw ${tri === 1 ? 'one triangle' : `${tri} triangles`} in each square (${b.triangles.length} chips).`
			);
		}
	}
	const letters = res.letterCount
		? ` and ${res.letterCount} letter${res.letterCount > 1 ? 's' : ''}`
		: '';
	steps.push(
		`Carve ${res.chipCount} chips${letters}: about ${res.estimateMinutes} minutes in ${woodName.toLowerCase()}. Cut away from the hand holding the work and keep the blade keen.`
	);
	return steps;
}
