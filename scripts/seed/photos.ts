/**
 * Demo photos: for each demo piece, a drawn "photo" of the piece in two of its woods — the
 * outline for its kind with a six-petal rosette, in the wood's tones — rendered by sharp and
 * stored as WebP variants like any uploaded photo. Relative imports only (runs under tsx).
 */
import sharp from 'sharp';
import { eq } from 'drizzle-orm';
import * as schema from '../../src/lib/server/db/schema';
import { storePhoto } from '../../src/lib/server/catalogue/photo-storage';
import type { DemoExtra } from './types';

const W = 1200;
const H = 900;

/** Six petals of a rosette of radius r at (cx, cy): each a lens between centre and rim point. */
function rosette(cx: number, cy: number, r: number, dark: string, light: string) {
	const parts: string[] = [
		`<circle cx="${cx}" cy="${cy}" r="${r}" fill="none" stroke="${dark}" stroke-opacity=".55" stroke-width="${r * 0.03}"/>`
	];
	for (let k = 0; k < 6; k++) {
		// Stepping starts on the horizontal centre line, so neighbours meet at petal tips.
		const a = (k * Math.PI) / 3;
		const px = cx + r * Math.cos(a);
		const py = cy + r * Math.sin(a);
		const mx = (cx + px) / 2;
		const my = (cy + py) / 2;
		// Each petal is two chips meeting along its spine: one face in shade, one in light.
		const petal = `M${cx},${cy} A${r},${r} 0 0 1 ${px},${py} A${r},${r} 0 0 1 ${cx},${cy}Z`;
		parts.push(`<path d="${petal}" fill="${dark}" fill-opacity=".82"/>`);
		parts.push(
			`<path d="M${cx},${cy} A${r},${r} 0 0 1 ${px},${py} L${mx},${my}Z" fill="${light}" fill-opacity=".55"/>`
		);
		// Small triangular chips between petals, near the rim.
		const b = a + Math.PI / 6;
		const tx = cx + r * 0.92 * Math.cos(b);
		const ty = cy + r * 0.92 * Math.sin(b);
		const s = r * 0.16;
		parts.push(
			`<path d="M${tx},${ty} l${s * Math.cos(b + 2.6)},${s * Math.sin(b + 2.6)} l${s * Math.cos(b - 2.6) - s * Math.cos(b + 2.6)},${s * Math.sin(b - 2.6) - s * Math.sin(b + 2.6)}Z" fill="${dark}" fill-opacity=".7"/>`
		);
	}
	return parts.join('');
}

function grain(x: number, y: number, w: number, h: number, dark: string, seed: number) {
	const lines: string[] = [];
	for (let i = 0; i < 14; i++) {
		const yy = y + ((i + 0.5) * h) / 14;
		const amp = 6 + ((seed * (i + 3)) % 9);
		lines.push(
			`<path d="M${x},${yy} C${x + w * 0.3},${yy - amp} ${x + w * 0.6},${yy + amp} ${x + w},${yy - amp / 2}" stroke="${dark}" stroke-opacity=".18" stroke-width="3" fill="none"/>`
		);
	}
	return lines.join('');
}

/** The piece's silhouette for its kind, as an SVG path or shape, centred on the canvas. */
function outline(kind: string, fill: string, edge: string) {
	const cx = W / 2;
	const cy = H / 2;
	const common = `fill="${fill}" stroke="${edge}" stroke-width="6"`;
	switch (kind) {
		case 'plate':
		case 'ornament': {
			const r = kind === 'plate' ? 360 : 300;
			const loop =
				kind === 'ornament'
					? `<circle cx="${cx}" cy="${cy - r - 28}" r="26" fill="none" stroke="${edge}" stroke-width="8"/>`
					: '';
			const rim =
				kind === 'plate'
					? `<circle cx="${cx}" cy="${cy}" r="${r - 50}" fill="none" stroke="${edge}" stroke-opacity=".35" stroke-width="4"/>`
					: '';
			return {
				shape: `${loop}<circle cx="${cx}" cy="${cy}" r="${r}" ${common}/>${rim}`,
				box: [cx - r, cy - r, 2 * r, 2 * r],
				rosette: [cx, cy, r * 0.5]
			};
		}
		case 'spoon':
			return {
				shape: `<ellipse cx="${cx - 220}" cy="${cy}" rx="220" ry="170" ${common}/><rect x="${cx - 40}" y="${cy - 45}" width="470" height="90" rx="45" ${common}/>`,
				box: [cx - 440, cy - 170, 900, 340],
				rosette: [cx + 260, cy, 38]
			};
		case 'box':
			return {
				shape: `<rect x="${cx - 400}" y="${cy - 280}" width="800" height="560" rx="26" ${common}/><rect x="${cx - 370}" y="${cy - 250}" width="740" height="500" rx="18" fill="none" stroke="${edge}" stroke-opacity=".35" stroke-width="4"/>`,
				box: [cx - 400, cy - 280, 800, 560],
				rosette: [cx, cy, 190]
			};
		case 'bottle_holder':
			return {
				shape: `<rect x="${cx - 520}" y="${cy - 160}" width="1040" height="320" rx="60" ${common}/><circle cx="${cx + 380}" cy="${cy}" r="62" fill="#f6efe3" stroke="${edge}" stroke-width="6"/>`,
				box: [cx - 520, cy - 160, 1040, 320],
				rosette: [cx - 200, cy, 125]
			};
		default:
			return {
				shape: `<rect x="${cx - 480}" y="${cy - 300}" width="960" height="600" rx="40" ${common}/>`,
				box: [cx - 480, cy - 300, 960, 600],
				rosette: [cx, cy, 200]
			};
	}
}

export function pieceSvg(
	kind: string,
	count: number,
	tone: { light: string; dark: string },
	seed: number
) {
	const o = outline(kind, tone.light, tone.dark);
	const [bx, by, bw, bh] = o.box;
	const [rx, ry, rr] = o.rosette;
	// Several rosettes overlap along a line, each centre on the last one's petal tip (spacing =
	// radius), as the layout engine lays them out; plates carry the band above the plain centre.
	const r = count >= 2 ? Math.min(rr, ((kind === 'plate' ? 0.6 : 0.8) * bw) / (count + 1)) : rr;
	const rowY = count >= 2 && kind === 'plate' ? by + bh * 0.3 : ry;
	const rosettes = Array.from({ length: Math.max(1, count) }, (_, k) =>
		rosette(rx + (k - (count - 1) / 2) * r, rowY, r, tone.dark, tone.light)
	);
	return `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}">
<defs>
<radialGradient id="bg" cx="50%" cy="40%" r="75%"><stop offset="0" stop-color="#f8f1e6"/><stop offset="1" stop-color="#e4d5bd"/></radialGradient>
<clipPath id="c">${o.shape}</clipPath>
<filter id="sh" x="-10%" y="-10%" width="130%" height="130%"><feDropShadow dx="10" dy="16" stdDeviation="14" flood-color="#3b2a1e" flood-opacity=".28"/></filter>
</defs>
<rect width="${W}" height="${H}" fill="url(#bg)"/>
<g filter="url(#sh)">${o.shape}</g>
<g clip-path="url(#c)">${grain(bx, by, bw, bh, tone.dark, seed)}</g>
${rosettes.join('')}
</svg>`;
}

export const demoPhotos: DemoExtra = {
	name: 'piece photos',
	async run(db, seeded) {
		const woodRows = await db.select().from(schema.woods);
		for (const [slug, pieceId] of Object.entries(seeded.pieceIds)) {
			const [piece] = await db.select().from(schema.pieces).where(eq(schema.pieces.id, pieceId));
			const woodIds = (
				await db.select().from(schema.pieceWoods).where(eq(schema.pieceWoods.pieceId, pieceId))
			).map((r) => r.woodId);
			const woods = woodRows.filter((w) => woodIds.includes(w.id)).slice(0, 2);
			const pattern = piece.pattern;
			for (const [i, w] of woods.entries()) {
				const svg = pieceSvg(
					piece.kind,
					pattern?.count ?? 1,
					{ light: w.toneLight, dark: w.toneDark },
					pieceId + i
				);
				const png = await sharp(Buffer.from(svg)).png().toBuffer();
				const key = `pieces/${slug}/${w.slug}`;
				const size = await storePhoto(key, png);
				await db.insert(schema.photos).values({
					pieceId,
					storageKey: key,
					alt: `${piece.title} in ${w.name.toLowerCase()}, drawn from above`,
					position: i,
					width: size.width,
					height: size.height
				});
			}
		}
	}
};
