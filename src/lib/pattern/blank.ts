/**
 * The blank the pattern goes on: width × length, the centre line down its length, a top end
 * that may be curved (a half circle across the full width), and a margin of plain wood kept
 * round the pattern. x runs across the width, y down the length from the top end.
 */
import { type Circle, fmt } from './geometry';

export type Blank = {
	widthMm: number;
	lengthMm: number;
	thicknessMm?: number;
	curvedTop?: boolean;
	marginMm: number;
};

export type Warning = { code: string; message: string };

export function blankOutline(b: Blank): string {
	const { widthMm: w, lengthMm: l } = b;
	if (b.curvedTop && l >= w / 2) {
		const r = w / 2;
		return `M0 ${fmt(r)}A${fmt(r)} ${fmt(r)} 0 0 1 ${fmt(w)} ${fmt(r)}L${fmt(w)} ${fmt(l)}L0 ${fmt(l)}Z`;
	}
	return `M0 0H${fmt(w)}V${fmt(l)}H0Z`;
}

/**
 * Rosette centres along the centre line, `spacing` apart. The first centre sits `firstCentreMm`
 * from the top end when given; otherwise the row is centred on the length.
 */
export function placeRosettes(
	b: Blank,
	r: number,
	count: number,
	spacing: number,
	firstCentreMm?: number
): Circle[] {
	const span = (count - 1) * spacing + 2 * r;
	const first = firstCentreMm ?? (b.lengthMm - span) / 2 + r;
	return Array.from({ length: count }, (_, i) => ({ x: b.widthMm / 2, y: first + i * spacing, r }));
}

export function fitWarnings(b: Blank, rosettes: Circle[]): Warning[] {
	const out: Warning[] = [];
	if (rosettes.length === 0) return out;
	const m = b.marginMm;
	const r = rosettes[0].r;
	const d = 2 * r;
	if (d + 2 * m > b.widthMm + 1e-9) {
		out.push({
			code: 'too-wide',
			message: `A ${fmt(d, 1)} mm rosette with ${fmt(m, 1)} mm of plain wood each side needs a blank ${fmt(d + 2 * m, 1)} mm wide; this one is ${fmt(b.widthMm, 1)} mm.`
		});
	}
	const top = rosettes[0].y - r;
	const bottom = rosettes[rosettes.length - 1].y + r;
	if (top < m - 1e-9 || bottom > b.lengthMm - m + 1e-9) {
		out.push({
			code: 'too-long',
			message: `The row of rosettes runs from ${fmt(top, 1)} to ${fmt(bottom, 1)} mm along a ${fmt(b.lengthMm, 1)} mm blank: it does not keep ${fmt(m, 1)} mm clear at the ends.`
		});
	}
	if (b.curvedTop) {
		const arch = { x: b.widthMm / 2, y: b.widthMm / 2, r: b.widthMm / 2 };
		rosettes.forEach((c, i) => {
			if (c.y < arch.y && Math.hypot(c.x - arch.x, c.y - arch.y) + c.r > arch.r - m + 1e-9) {
				out.push({
					code: 'top-end',
					message: `Rosette ${i + 1} runs into the curved top end; move the row down or use a smaller diameter.`
				});
			}
		});
	}
	return out;
}
