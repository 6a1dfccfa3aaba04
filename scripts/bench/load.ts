/**
 * HTTP load with autocannon: requests/s, p50 and p99 at 50 connections for 10 s, and a bare
 * single-process node:http server answering the same bytes as /shop, as the machine's ceiling.
 * Every URL, the bare server's included, is warmed by a short untimed run of the same load first.
 */
import { spawn } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import autocannon from 'autocannon';

export type LoadFigure = {
	name: string;
	url: string;
	reqPerSec: number;
	p50: number;
	p99: number;
	errors: number;
	non2xx: number;
};

export const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS || 50);
export const DURATION_S = Number(process.env.BENCH_SECONDS || 10);
/** Untimed seconds of the same load before each timed run, so no figure is a cold start. */
export const WARM_S = Number(process.env.BENCH_WARM_SECONDS ?? 2);

export async function measure(
	name: string,
	url: string,
	headers: Record<string, string> = {}
): Promise<LoadFigure> {
	// The first run after a start or a page-cache change would otherwise measure JIT warm-up, the
	// first render and the compression of the stored entry, not the steady state.
	if (WARM_S > 0) await autocannon({ url, connections: CONNECTIONS, duration: WARM_S, headers });
	const r = await autocannon({ url, connections: CONNECTIONS, duration: DURATION_S, headers });
	return {
		name,
		url,
		reqPerSec: Math.round(r.requests.average),
		p50: r.latency.p50,
		p99: r.latency.p99,
		errors: r.errors,
		non2xx: r.non2xx
	};
}

/** Starts the bare server in a child process (so it does not share this process's loop). */
export async function startBareServer(body: Buffer, contentType: string, dir: string) {
	const file = path.join(dir, 'bare-body.html');
	writeFileSync(file, body);
	const src = `
		const http = require('node:http');
		const body = require('node:fs').readFileSync(${JSON.stringify(file)});
		const s = http.createServer((req, res) => {
			res.writeHead(200, { 'content-type': ${JSON.stringify(contentType)}, 'content-length': body.length });
			res.end(body);
		});
		s.listen(0, '127.0.0.1', () => process.stdout.write(String(s.address().port) + '\\n'));`;
	const child = spawn(process.execPath, ['-e', src], { stdio: ['ignore', 'pipe', 'inherit'] });
	const port = await new Promise<number>((resolve, reject) => {
		child.stdout.once('data', (d: Buffer) => resolve(Number(d.toString().trim())));
		child.once('exit', (c) => reject(new Error(`bare server exited ${c}`)));
	});
	return {
		url: `http://127.0.0.1:${port}/shop`,
		stop: () =>
			new Promise<void>((r) => {
				child.once('exit', () => r());
				child.kill('SIGTERM');
			})
	};
}

export const formatLoad = (f: LoadFigure) =>
	`${f.name.padEnd(34)} ${String(f.reqPerSec).padStart(7)} req/s   p50 ${String(f.p50).padStart(4)} ms   p99 ${String(f.p99).padStart(4)} ms` +
	(f.errors || f.non2xx ? `   (${f.errors} errors, ${f.non2xx} non-2xx)` : '');
