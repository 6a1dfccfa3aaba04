/**
 * Makes the shop's icons from static/favicon.svg with sharp: favicon.ico (16, 32 and 48 px),
 * apple-touch-icon.png (180 px) and icon-192.png / icon-512.png for home-screen shortcuts.
 * Run once after the logo changes (`npx tsx scripts/make-icons.ts`); the files are committed.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import { buildIco } from '../src/lib/seo/ico';

const dir = path.resolve(import.meta.dirname, '..', 'static');
const svg = readFileSync(path.join(dir, 'favicon.svg'));

/** The SVG drawn at `size` px square (rendered large enough that edges stay crisp). */
const png = (size: number) =>
	sharp(svg, { density: Math.max(72, Math.ceil((72 * size) / 64)) })
		.resize(size, size)
		.png({ compressionLevel: 9 })
		.toBuffer();

const ico = buildIco(
	await Promise.all([16, 32, 48].map(async (size) => ({ size, png: await png(size) })))
);
writeFileSync(path.join(dir, 'favicon.ico'), ico);
writeFileSync(path.join(dir, 'apple-touch-icon.png'), await png(180));
writeFileSync(path.join(dir, 'icon-192.png'), await png(192));
writeFileSync(path.join(dir, 'icon-512.png'), await png(512));
console.log('icons written to static/');
