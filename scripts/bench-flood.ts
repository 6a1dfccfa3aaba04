/**
 * The shop's p99 while /api/pattern is flooded, against its unloaded p99 (target: within 3×).
 * Uses BENCH_URL when set; otherwise starts the app the way `npm start` does on a free port and
 * stops it afterwards. Load comes from autocannon (npm). Prints, does not fail.
 */
import { spawn } from 'node:child_process';
import autocannon from 'autocannon';
import { BIN, ROOT } from './lib/paths';
import { freePort, portAnswers } from './lib/services';

/** A heavy layout that is still within the pattern API's bound. */
const HEAVY = '/api/pattern?diameter=150&count=6&width=1000&length=2000&spacing=50&initials=HMW';
const seconds = Number(process.env.BENCH_FLOOD_S || 10);

type Result = autocannon.Result;
const run = (url: string, connections: number): Promise<Result> =>
	autocannon({ url, connections, duration: seconds, timeout: 10 });

async function startApp(): Promise<{ base: string; stop: () => Promise<void> }> {
	if (process.env.BENCH_URL) return { base: process.env.BENCH_URL, stop: async () => {} };
	const port = await freePort(3400);
	const child = spawn(BIN('tsx'), ['scripts/start.ts'], {
		cwd: ROOT,
		env: { ...process.env, PORT: String(port), ORIGIN: `http://localhost:${port}` },
		stdio: ['ignore', 'ignore', 'inherit']
	});
	const deadline = Date.now() + 180_000;
	while (!(await portAnswers(port))) {
		if (Date.now() > deadline || child.exitCode !== null) throw new Error('the app did not start');
		await new Promise((r) => setTimeout(r, 300));
	}
	return {
		base: `http://localhost:${port}`,
		stop: () =>
			new Promise<void>((r) => {
				child.once('exit', () => r());
				child.kill('SIGINT');
			})
	};
}

export async function floodBench(): Promise<string[]> {
	const app = await startApp();
	try {
		await run(`${app.base}/`, 4); // warm up
		const unloaded = await run(`${app.base}/`, 10);
		const [flood, loaded] = await Promise.all([
			run(`${app.base}${HEAVY}`, 200),
			run(`${app.base}/`, 10)
		]);
		const ratio = loaded.latency.p99 / Math.max(1, unloaded.latency.p99);
		const codes = Object.entries(flood.statusCodeStats ?? {})
			.map(([c, s]) => `${c}×${(s as { count: number }).count}`)
			.join(' ');
		return [
			`shop home p99, unloaded (10 connections, ${seconds} s)        ${unloaded.latency.p99.toFixed(0).padStart(6)} ms`,
			`shop home p99, /api/pattern flooded by 200 connections ${loaded.latency.p99.toFixed(0).padStart(6)} ms   (${ratio.toFixed(2)}× unloaded; target ≤ 3×: ${ratio <= 3 ? 'met' : 'MISSED'})`,
			`  flood answers: ${codes} (timeouts ${flood.timeouts}); shop errors ${loaded.errors}, non-2xx ${loaded.non2xx}`
		];
	} finally {
		await app.stop();
	}
}
