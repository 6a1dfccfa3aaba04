/**
 * Draws the installed booth app's PNG icons from static/booth-icon.svg with sharp:
 * 192 and 512 px for the web manifest (the shop's apple-touch icon comes from
 * scripts/make-icons.ts). Run after changing the SVG:
 *   npx tsx scripts/booth-icons.ts
 */
import sharp from 'sharp';
import { readFileSync } from 'node:fs';
import path from 'node:path';

const dir = path.resolve(import.meta.dirname, '../static');
const svg = readFileSync(path.join(dir, 'booth-icon.svg'));

for (const size of [192, 512]) {
	await sharp(svg, { density: 300 })
		.resize(size, size)
		.png()
		.toFile(path.join(dir, `booth-icon-${size}.png`));
}
