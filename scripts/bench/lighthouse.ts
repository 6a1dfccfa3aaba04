/**
 * Lab LCP with Lighthouse (pinned 12.2.3, which runs on Node 20) driving Debian's Chromium.
 *
 * Two presets: Lighthouse's default mobile one (Moto G Power screen 412×823 at DPR 1.75, 4×
 * CPU slowdown, simulated "slow 4G": 150 ms round trip, 1.6 Mbit/s down) and its desktop one
 * (1350×940, no CPU slowdown, 40 ms round trip, 10 Mbit/s). Both use simulated throttling
 * (Lantern): the page loads unthrottled, then Lighthouse replays what loaded before the largest
 * paint on the simulated network and CPU.
 *
 * Lighthouse 12.2.3's own "LCP element" audit fails against the newer Chromium here (its
 * RootCauses gatherer errors), so the element and its phases come from the trace Lighthouse
 * saves: the last `largestContentfulPaint::Candidate` and, for a photo, its discovery, load start
 * and load end. Those phases are the unthrottled run's; the LCP figure is the simulated one.
 * Each page is measured `runs` times and the median kept, as Lighthouse's docs advise for
 * variance (a shared machine makes single runs swing by hundreds of milliseconds).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import path from 'node:path';
import { BIN } from '../lib/paths';

const CHROMIUM = process.env.CHROMIUM_PATH || '/usr/bin/chromium';
const FLAGS = [
	'--headless=new',
	'--no-sandbox',
	'--disable-gpu',
	'--disable-background-networking',
	'--disable-component-update',
	'--disable-sync',
	'--no-first-run'
].join(' ');

export type Preset = 'mobile' | 'desktop';

/** Observed (unthrottled) phases of the largest paint, in ms from navigation start. */
export type LcpPhases = {
	ttfbMs: number;
	loadDelayMs?: number;
	loadTimeMs?: number;
	renderDelayMs: number;
};

export type LabRun = {
	lcpMs: number;
	fcpMs: number;
	observedLcpMs: number;
	element: string;
	imageUrl?: string;
	phases: LcpPhases;
	/** Requests that finished before the observed largest paint: what Lantern replays. */
	before: { requests: number; kb: number };
};

export type LabLcp = {
	preset: Preset;
	lcpMs: number | null;
	note?: string;
	runs: LabRun[];
	median?: LabRun;
};

type TraceEvent = {
	name: string;
	ts: number;
	pid: number;
	args?: { data?: Record<string, unknown> };
};
type Report = {
	audits: Record<
		string,
		{ numericValue?: number; details?: { items?: Record<string, unknown>[] } }
	>;
	runtimeError?: { message: string };
};

function oneRun(url: string, dir: string, preset: Preset): LabRun | string {
	const out = path.join(dir, `lighthouse-${process.pid}-${Date.now()}.json`);
	const r = spawnSync(
		BIN('lighthouse'),
		[
			url,
			'--only-categories=performance',
			...(preset === 'desktop' ? ['--preset=desktop'] : []),
			'--output=json',
			`--output-path=${out}`,
			'--save-assets',
			`--chrome-flags=${FLAGS}`,
			'--quiet'
		],
		{ env: { ...process.env, CHROME_PATH: CHROMIUM }, encoding: 'utf8', timeout: 150_000 }
	);
	const base = path.basename(out, '.json');
	const cleanup = () => {
		for (const f of readdirSync(dir)) if (f.startsWith(base)) rmSync(path.join(dir, f));
	};
	try {
		if (r.status !== 0 || !existsSync(out)) {
			const why = (r.stderr || r.error?.message || `exit ${r.status}`).trim().split('\n');
			return `Lighthouse did not run: ${why.slice(-3).join(' | ')}`;
		}
		const report = JSON.parse(readFileSync(out, 'utf8')) as Report;
		const lcp = report.audits['largest-contentful-paint']?.numericValue;
		const fcp = report.audits['first-contentful-paint']?.numericValue;
		if (lcp === undefined || fcp === undefined)
			return report.runtimeError?.message ?? 'no LCP in the report';
		const traceFile = path.join(dir, `${base}-0.trace.json`);
		const trace = JSON.parse(readFileSync(traceFile, 'utf8')) as
			{ traceEvents: TraceEvent[] } | TraceEvent[];
		return describe(report, Array.isArray(trace) ? trace : trace.traceEvents, lcp, fcp);
	} finally {
		cleanup();
	}
}

function describe(report: Report, events: TraceEvent[], lcp: number, fcp: number): LabRun {
	const nav =
		events.find((e) => e.name === 'navigationStart' && e.args?.data?.isLoadingMainFrame) ??
		events.find((e) => e.name === 'navigationStart');
	const t0 = nav?.ts ?? 0;
	const pid = nav?.pid;
	const mine = (e: TraceEvent) => pid === undefined || e.pid === pid;
	const candidates = events.filter(
		(e) => e.name === 'largestContentfulPaint::Candidate' && mine(e)
	);
	const last = candidates.at(-1);
	const data = (last?.args?.data ?? {}) as Record<string, number | string | undefined>;
	const observedLcpMs = last ? (last.ts - t0) / 1000 : 0;
	const images = events.filter((e) => e.name === 'LargestImagePaint::Candidate' && mine(e));
	const imageUrl = images.at(-1)?.args?.data?.imageUrl as string | undefined;
	const requests = (report.audits['network-requests']?.details?.items ?? []) as {
		url: string;
		resourceType?: string;
		networkEndTime: number;
		transferSize?: number;
	}[];
	const doc = requests.find((q) => q.resourceType === 'Document');
	const ttfbMs = doc?.networkEndTime ?? 0;
	const done = requests.filter((q) => q.networkEndTime <= observedLcpMs);
	const phases: LcpPhases =
		data.type === 'image' && typeof data.imageLoadEnd === 'number'
			? {
					ttfbMs,
					loadDelayMs: Number(data.imageLoadStart) - ttfbMs,
					loadTimeMs: Number(data.imageLoadEnd) - Number(data.imageLoadStart),
					renderDelayMs: observedLcpMs - Number(data.imageLoadEnd)
				}
			: { ttfbMs, renderDelayMs: observedLcpMs - ttfbMs };
	return {
		lcpMs: Math.round(lcp),
		fcpMs: Math.round(fcp),
		observedLcpMs: Math.round(observedLcpMs),
		element: `${data.type ?? '?'} ${String(data.nodeName ?? '?').slice(0, 90)}`,
		imageUrl: imageUrl?.replace(/^https?:\/\/[^/]+/, ''),
		phases: Object.fromEntries(
			Object.entries(phases).map(([k, v]) => [k, Math.round(v)])
		) as LcpPhases,
		before: {
			requests: done.length,
			kb: Math.round(done.reduce((n, q) => n + (q.transferSize ?? 0), 0) / 102.4) / 10
		}
	};
}

export function labLcp(url: string, dir: string, preset: Preset, runs = 3): LabLcp {
	if (!existsSync(CHROMIUM))
		return { preset, lcpMs: null, runs: [], note: `${CHROMIUM} is not installed` };
	const done: LabRun[] = [];
	let note: string | undefined;
	for (let i = 0; i < runs; i++) {
		const r = oneRun(url, dir, preset);
		if (typeof r === 'string') note = r;
		else done.push(r);
	}
	if (!done.length) return { preset, lcpMs: null, runs: [], note };
	const sorted = [...done].sort((a, b) => a.lcpMs - b.lcpMs);
	const median = sorted[Math.floor((sorted.length - 1) / 2)];
	return { preset, lcpMs: median.lcpMs, runs: done, median, note };
}

/** Lines for the bench's printout. */
export function formatLab(name: string, v: LabLcp): string[] {
	if (v.lcpMs === null || !v.median) return [`${name.padEnd(6)} ${v.preset.padEnd(8)} ${v.note}`];
	const m = v.median;
	const p = m.phases;
	const all = v.runs.map((r) => r.lcpMs).join(', ');
	return [
		`${name.padEnd(6)} ${v.preset.padEnd(8)} LCP ${m.lcpMs} ms (median of ${all})   FCP ${m.fcpMs} ms`,
		`       largest paint: ${m.element}${m.imageUrl ? ` ${m.imageUrl}` : ''}`,
		`       unthrottled: document ${p.ttfbMs} ms` +
			(p.loadTimeMs !== undefined
				? `, photo load delay ${p.loadDelayMs} ms, load ${p.loadTimeMs} ms`
				: '') +
			`, render delay ${p.renderDelayMs} ms → painted at ${m.observedLcpMs} ms; ` +
			`${m.before.requests} requests (${m.before.kb} KB) done by then`
	];
}
