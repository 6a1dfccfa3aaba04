/**
 * The preview drawing as an SVG string, in the wood's own tones. Each chip is shaded as the
 * pocket a knife leaves: one sloping wall per edge, falling to the chip's lowest point, lit from
 * the top left, so petals read as carved lenses and not as flat shapes.
 */
import type { Edge } from './arrangement';
import { type Point, fmt, onCircle } from './geometry';
import { edgeCommand } from './paths';
import type { Drawing } from './types';

type Tones = { name: string; toneLight: string; toneDark: string };

const LIGHT = { x: -Math.SQRT1_2, y: -Math.SQRT1_2 }; // towards the light: top left

function hex(c: string): [number, number, number] {
	const m = /^#?([0-9a-f]{6})$/i.exec(c);
	const n = m ? parseInt(m[1], 16) : 0xccaa88;
	return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

export function mix(a: string, b: string, t: number): string {
	const x = hex(a);
	const y = hex(b);
	const c = x.map((v, i) => Math.round(v + (y[i] - v) * t));
	return `#${c.map((v) => v.toString(16).padStart(2, '0')).join('')}`;
}

function esc(s: string): string {
	return s.replace(/[&<>"']/g, (ch) => `&#${ch.charCodeAt(0)};`);
}

function edgeMid(e: Edge): Point {
	if (e.kind === 'line') return { x: (e.from.x + e.to.x) / 2, y: (e.from.y + e.to.y) / 2 };
	return onCircle(e.c, e.start + e.sweep / 2);
}

/** One sloping wall from an edge down to the chip's lowest point. */
function wall(e: Edge, low: Point, tones: Tones): string {
	const m = edgeMid(e);
	const ox = m.x - low.x;
	const oy = m.y - low.y;
	const len = Math.hypot(ox, oy) || 1;
	// A wall on the far side from the light faces it and catches it.
	const lit = 0.5 - 0.5 * ((ox / len) * LIGHT.x + (oy / len) * LIGHT.y);
	const fill = mix(tones.toneDark, tones.toneLight, 0.1 + 0.75 * lit);
	return `<path d="M${fmt(low.x)} ${fmt(low.y)}L${fmt(e.from.x)} ${fmt(e.from.y)}${edgeCommand(e)}Z" fill="${fill}" stroke="${fill}" stroke-width="0.15"/>`;
}

function triangleWalls(pts: Point[], tones: Tones): string {
	const low = { x: (pts[0].x + pts[1].x + pts[2].x) / 3, y: (pts[0].y + pts[1].y + pts[2].y) / 3 };
	return pts
		.map((p, i) => {
			const q = pts[(i + 1) % 3];
			return wall({ kind: 'line', group: -1, from: p, to: q }, low, tones);
		})
		.join('');
}

function grain(w: number, l: number, color: string, clip: string): string {
	const lines: string[] = [];
	const n = Math.max(4, Math.round(w / 9));
	for (let i = 0; i < n; i++) {
		const x = ((i + 0.5) * w) / n + Math.sin(i * 2.3) * 2;
		const wob = 1.2 + (i % 3) * 0.8;
		lines.push(
			`M${fmt(x)} -2C${fmt(x + wob * 2)} ${fmt(l * 0.3)} ${fmt(x - wob * 2)} ${fmt(l * 0.6)} ${fmt(x + wob)} ${fmt(l + 2)}`
		);
	}
	return `<path d="${lines.join('')}" fill="none" stroke="${color}" stroke-width="0.35" opacity="0.35" clip-path="url(#${clip})"/>`;
}

export type ViewBox = { x: number; y: number; w: number; h: number };

export function renderSvg(d: Drawing, tones: Tones, id = 'rz', pad = 4, view?: ViewBox): string {
	const { blank } = d;
	const vb = view ?? { x: -pad, y: -pad, w: d.widthMm + 2 * pad, h: d.heightMm + 2 * pad };
	const surface = tones.toneLight;
	const ink = mix(tones.toneDark, '#2e2118', 0.55);
	const parts: string[] = [];
	parts.push(
		`<svg xmlns="http://www.w3.org/2000/svg" viewBox="${fmt(vb.x)} ${fmt(vb.y)} ${fmt(vb.w)} ${fmt(vb.h)}" role="img" aria-labelledby="${id}-t">`,
		`<title id="${id}-t">${esc(`Carving layout on ${tones.name.toLowerCase()}: ${d.chips.length} chips${d.lettering ? `, initials ${d.lettering.text}` : ''}`)}</title>`,
		`<defs><linearGradient id="${id}-w" x1="0" y1="0" x2="1" y2="1"><stop offset="0" stop-color="${surface}"/><stop offset="1" stop-color="${mix(surface, tones.toneDark, 0.28)}"/></linearGradient>`,
		`<clipPath id="${id}-c"><path d="${blank.outline}"/></clipPath></defs>`,
		`<path d="${blank.outline}" fill="url(#${id}-w)"/>`,
		grain(blank.widthMm, blank.lengthMm, tones.toneDark, `${id}-c`)
	);
	// Centre line, dashed and faint: a pencil line the carver sands off afterwards.
	parts.push(
		`<path d="M${fmt(d.centreLineX)} 0V${fmt(blank.lengthMm)}" stroke="${ink}" stroke-width="0.8" stroke-dasharray="6 4" opacity="0.45" vector-effect="non-scaling-stroke" clip-path="url(#${id}-c)"/>`
	);
	for (const c of d.chips) {
		if (c.edges.length)
			parts.push(`<g>${c.edges.map((e) => wall(e, c.centroid, tones)).join('')}</g>`);
	}
	parts.push(
		`<path d="${d.lines}" fill="none" stroke="${ink}" stroke-width="0.9" stroke-linecap="round" vector-effect="non-scaling-stroke"/>`
	);
	const lt = d.lettering;
	if (lt) {
		const m = lt.medallion;
		parts.push(
			`<circle cx="${fmt(m.x)}" cy="${fmt(m.y)}" r="${fmt(m.r)}" fill="${surface}" stroke="${ink}" stroke-width="1" vector-effect="non-scaling-stroke"/>`
		);
		if (lt.letters.length) {
			const fill = mix(tones.toneDark, '#2e2118', 0.55);
			parts.push(
				`<path d="${lt.letters.map((l) => l.d).join('')}" fill="${fill}" stroke="${ink}" stroke-width="0.6" vector-effect="non-scaling-stroke"/>`
			);
		} else {
			parts.push(
				`<text x="${fmt(lt.baseline.x)}" y="${fmt(lt.baseline.y)}" text-anchor="middle" font-family="Nunito, sans-serif" font-weight="800" font-size="${fmt(lt.capHeightMm / 0.705)}" fill="${mix(tones.toneDark, '#2e2118', 0.55)}">${esc(lt.text)}</text>`
			);
		}
	}
	parts.push(
		`<path d="${blank.outline}" fill="none" stroke="${ink}" stroke-width="1.4" vector-effect="non-scaling-stroke"/>`
	);
	const b = d.border;
	if (b) {
		const at = (p: Point) => ({ x: b.x + p.y, y: b.y + p.x });
		parts.push(
			`<rect x="${fmt(b.x)}" y="${fmt(b.y)}" width="${fmt(b.edgeMm)}" height="${fmt(b.lengthMm)}" fill="${surface}" stroke="${ink}" stroke-width="1.2" vector-effect="non-scaling-stroke"/>`
		);
		for (const t of b.triangles) parts.push(triangleWalls(t.map(at), tones));
		const rules = b.rules
			.map((v) => `M${fmt(b.x + v)} ${fmt(b.y)}V${fmt(b.y + b.lengthMm)}`)
			.join('');
		parts.push(
			`<path d="${rules}" stroke="${ink}" stroke-width="0.6" opacity="0.6" vector-effect="non-scaling-stroke"/>`
		);
	}
	parts.push('</svg>');
	return parts.join('');
}
