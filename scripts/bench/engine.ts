/**
 * Speed of the layout engine: median time for pattern + SVG (three rosettes with initials) and
 * for the 1:1 template PDF (targets: under 2 ms and under 150 ms), and the packing slip PDF
 * (one order, and a batch of ten). Prints, does not fail.
 */
import { performance } from 'node:perf_hooks';
import { computePattern } from '../../src/lib/pattern';
import { letterFont } from '../../src/lib/pattern/letter-font';
import { templatePdf } from '../../src/lib/server/pdf/template';
import { slipsPdf } from '../../src/lib/server/pdf/packing-slip';
import type { SlipOrder } from '../../src/lib/server/pdf/slip-data';

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

// An invented order for the slip: two lines, one personalised, and a gift note.
const slipShop = {
	name: 'Chipstall',
	email: 'hollis@chipstall.test',
	address: ['Chipstall workshop', '14 Millrace Lane', 'Linden Ford, VT 05099', 'US']
};
const slipOrder = (ref: string): SlipOrder => ({
	ref,
	buyerName: 'Orla Finch',
	address: ['Orla Finch', '9 Weir Street', 'Coldbrook, NH 03222', 'US'],
	giftNote: 'For the new kitchen.',
	currency: 'USD',
	subtotalMinor: 9600,
	shippingMinor: 1195,
	taxMinor: 0,
	totalMinor: 10795,
	placedOn: '2026-03-02',
	readyBy: 'Thursday, March 12, 2026',
	lines: [
		{
			title: 'Rosette bottle holder',
			woodName: 'Cherry',
			quantity: 1,
			unitPriceMinor: 5800,
			lineTotalMinor: 5800,
			initials: 'OF',
			style: 'block'
		},
		{
			title: 'Star ornament',
			woodName: 'Basswood',
			quantity: 2,
			unitPriceMinor: 1900,
			lineTotalMinor: 3800,
			initials: null,
			style: null
		}
	]
});
/** Runs in the bench process itself: pure computation, no server. */
export async function engineTimings() {
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
	const slipOpts = { paper: 'a4', kind: 'packing', origin: 'http://localhost:3000' } as const;
	const slipMs = await timeIt(30, () => slipsPdf(slipShop, [slipOrder('CS-7K2M9P')], slipOpts));
	const tenOrders = Array.from({ length: 10 }, (_, i) => slipOrder(`CS-BENCH${i}`));
	const slipBatchMs = await timeIt(10, () => slipsPdf(slipShop, tenOrders, slipOpts));
	const mem = process.memoryUsage();

	const line = (label: string, ms: number, target?: number) =>
		`${label.padEnd(52)} ${ms.toFixed(3).padStart(9)} ms${target ? `   (target < ${target} ms: ${ms < target ? 'met' : 'MISSED'})` : ''}`;
	const lines = [
		line('pattern + SVG, 3 rosettes with initials (median)', patternMs, 2),
		line('pattern + SVG, 3 rosettes, halved chips (median)', halvedMs),
		line('template PDF, A4, one tile (median)', pdfMs, 150),
		line('template PDF, Letter, 600 mm blank + border, tiled', bigPdfMs),
		line('packing slip PDF, A4, one order with QR (median)', slipMs),
		line('packing slips PDF, A4, batch of ten orders (median)', slipBatchMs),
		`heap used ${(mem.heapUsed / 1048576).toFixed(1)} MB (grew ${((mem.heapUsed - heapBefore) / 1048576).toFixed(1)} MB), rss ${(mem.rss / 1048576).toFixed(1)} MB`
	];
	return {
		figures: {
			patternMs,
			halvedMs,
			templatePdfMs: pdfMs,
			bigTemplatePdfMs: bigPdfMs,
			packingSlipMs: slipMs,
			packingSlipBatchMs: slipBatchMs
		},
		lines
	};
}
