/**
 * Speed of the layout engine: median time for pattern + SVG (three rosettes with initials) and
 * for the 1:1 template PDF. Targets: under 2 ms and under 150 ms. Prints, does not fail.
 */
import { performance } from 'node:perf_hooks';
import { computePattern } from '../src/lib/pattern';
import { letterFont } from '../src/lib/pattern/letter-font';
import { templatePdf } from '../src/lib/server/pdf/template';

function median(xs: number[]): number {
	const s = [...xs].sort((a, b) => a - b);
	return s[Math.floor(s.length / 2)];
}

async function timeIt(runs: number, fn: () => unknown): Promise<number> {
	for (let i = 0; i < Math.min(20, runs); i++) await fn(); // warm up
	const times: number[] = [];
	for (let i = 0; i < runs; i++) {
		const t0 = performance.now();
		await fn();
		times.push(performance.now() - t0);
	}
	return median(times);
}

const font = letterFont();
const input = {
	diameterMm: 70,
	count: 3,
	initials: 'HMW',
	woodSlug: 'cherry',
	widthMm: 100,
	lengthMm: 300
};
const heapBefore = process.memoryUsage().heapUsed;

// Vary the initials so the per-text outline cache does not flatter the figure.
const letters = ['HMW', 'ABC', 'JK', 'Q', 'XYZ', 'LF'];
let n = 0;
const patternMs = await timeIt(500, () =>
	computePattern({ ...input, initials: letters[n++ % letters.length] }, { font })
);
const halvedMs = await timeIt(200, () => computePattern({ ...input, split: true }, { font }));
const result = computePattern(input, { font });
const pdfMs = await timeIt(30, () =>
	templatePdf(result, { paper: 'a4', orderRef: 'CS-1042', title: 'Bottle holder' })
);
const bigPdfMs = await timeIt(15, () =>
	templatePdf(
		computePattern({ ...input, count: 6, lengthMm: 600, border: { edgeMm: 26 } }, { font }),
		{ paper: 'letter' }
	)
);
const mem = process.memoryUsage();

const line = (label: string, ms: number, target?: number) =>
	`${label.padEnd(52)} ${ms.toFixed(3).padStart(9)} ms${target ? `   (target < ${target} ms: ${ms < target ? 'met' : 'MISSED'})` : ''}`;
process.stdout.write(
	[
		line('pattern + SVG, 3 rosettes with initials (median)', patternMs, 2),
		line('pattern + SVG, 3 rosettes, halved chips (median)', halvedMs),
		line('template PDF, A4, one tile (median)', pdfMs, 150),
		line('template PDF, Letter, 600 mm blank + border, tiled', bigPdfMs),
		`heap used ${(mem.heapUsed / 1048576).toFixed(1)} MB (grew ${((mem.heapUsed - heapBefore) / 1048576).toFixed(1)} MB), rss ${(mem.rss / 1048576).toFixed(1)} MB`,
		''
	].join('\n')
);

// The shop under a pattern-API flood (starts the app unless BENCH_URL is set).
const { floodBench } = await import('./bench-flood');
process.stdout.write((await floodBench()).join('\n') + '\n');
