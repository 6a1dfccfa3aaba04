/**
 * Lab LCP with Lighthouse (pinned 12.2.3, which runs on Node 20) driving Debian's Chromium,
 * mobile preset with its default simulated throttling. Returns null and a reason when it cannot run.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, rmSync } from 'node:fs';
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

export type LabLcp = { lcpMs: number | null; note?: string; element?: string; blocking?: string[] };

/** The LCP element's snippet from the report ("what was the largest paint"), when Lighthouse named it. */
function lcpElement(audit: unknown): string | undefined {
	const items = (audit as { details?: { items?: { items?: { node?: { snippet?: string } }[] }[] } })
		?.details?.items;
	return items?.[0]?.items?.[0]?.node?.snippet?.slice(0, 160);
}

export function labLcp(url: string, dir: string): LabLcp {
	if (!existsSync(CHROMIUM)) return { lcpMs: null, note: `${CHROMIUM} is not installed` };
	const out = path.join(dir, `lighthouse-${Date.now()}.json`);
	const r = spawnSync(
		BIN('lighthouse'),
		[
			url,
			'--only-audits=largest-contentful-paint,largest-contentful-paint-element,render-blocking-resources',
			'--output=json',
			`--output-path=${out}`,
			`--chrome-flags=${FLAGS}`,
			'--quiet'
		],
		{ env: { ...process.env, CHROME_PATH: CHROMIUM }, encoding: 'utf8', timeout: 120_000 }
	);
	if (r.status !== 0 || !existsSync(out)) {
		const why = (r.stderr || r.error?.message || `exit ${r.status}`).trim().split('\n').slice(-3);
		return { lcpMs: null, note: `Lighthouse did not run: ${why.join(' | ')}` };
	}
	const report = JSON.parse(readFileSync(out, 'utf8')) as {
		audits: Record<
			string,
			{ numericValue?: number; details?: { items?: { url?: string; wastedMs?: number }[] } }
		>;
		runtimeError?: { message: string };
	};
	rmSync(out, { force: true });
	const v = report.audits['largest-contentful-paint']?.numericValue;
	if (v === undefined)
		return { lcpMs: null, note: report.runtimeError?.message ?? 'no LCP in the report' };
	const blocking = (report.audits['render-blocking-resources']?.details?.items ?? []).map(
		(i) => `${i.url?.replace(/^https?:\/\/[^/]+/, '')} (${Math.round(i.wastedMs ?? 0)} ms)`
	);
	return {
		lcpMs: Math.round(v),
		element: lcpElement(report.audits['largest-contentful-paint-element']),
		blocking
	};
}
