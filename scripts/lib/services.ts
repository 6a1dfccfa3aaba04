/**
 * Child processes the start, dev and test scripts run: the local stand-ins for mail, S3 and
 * Stripe (mocks/<name>/server.ts), and the app itself. Each writes a pid file under .data/run
 * so `npm run stop` can end leftovers of a run that was killed hard.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { config } from '../../config/settings';
import { BIN, ROOT, RUN_DIR } from './paths';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export function portAnswers(port: number, host = '127.0.0.1'): Promise<boolean> {
	return new Promise((resolve) => {
		const s = net.connect({ port, host });
		s.setTimeout(1000);
		s.once('connect', () => (s.destroy(), resolve(true)));
		s.once('error', () => resolve(false));
		s.once('timeout', () => (s.destroy(), resolve(false)));
	});
}

/** True when nothing on this machine holds the port (tried by listening on it for a moment). */
export function portFree(port: number): Promise<boolean> {
	return new Promise((resolve) => {
		const srv = net.createServer();
		srv.once('error', () => resolve(false));
		srv.listen({ port, host: '127.0.0.1', exclusive: true }, () => srv.close(() => resolve(true)));
	});
}

/** The preferred port when free, else one the system hands out. */
export async function freePort(preferred: number): Promise<number> {
	if (await portFree(preferred)) return preferred;
	return new Promise((resolve, reject) => {
		const srv = net.createServer();
		srv.once('error', reject);
		srv.listen({ port: 0, host: '127.0.0.1' }, () => {
			const { port } = srv.address() as net.AddressInfo;
			srv.close(() => resolve(port));
		});
	});
}

export type Mock = { name: string; file: string; ports: number[] };

/** The stand-ins with the ports they listen on (read from config, so env overrides apply). */
export function mocks(): Mock[] {
	return [
		{
			name: 'mail',
			file: 'mocks/mail/server.ts',
			ports: [config.mail.port, config.mail.inboxPort]
		},
		{ name: 's3', file: 'mocks/s3/server.ts', ports: [config.s3.port] },
		{
			name: 'stripe',
			file: 'mocks/stripe/server.ts',
			// Same fallback as the stand-in itself uses when the API port is cleared for production.
			ports: [config.stripe.port ?? 12111]
		}
	];
}

export type Started = { name: string; child: ChildProcess; pidFile: string };

function pidFileFor(name: string, ports: number[]) {
	return path.join(RUN_DIR, `${name}-${ports[0]}.pid`);
}

/** Spawns a child in the project root and records its pid. */
export function spawnTracked(
	name: string,
	command: string,
	args: string[],
	opts: { env?: NodeJS.ProcessEnv; ports?: number[]; quiet?: boolean } = {}
): Started {
	mkdirSync(RUN_DIR, { recursive: true });
	const child = spawn(command, args, {
		cwd: ROOT,
		env: opts.env ?? process.env,
		stdio: opts.quiet ? ['ignore', 'ignore', 'inherit'] : 'inherit'
	});
	const pidFile = pidFileFor(name, opts.ports ?? [0]);
	if (child.pid) writeFileSync(pidFile, String(child.pid));
	child.once('exit', () => rmSync(pidFile, { force: true }));
	return { name, child, pidFile };
}

async function waitForPorts(s: Started, ports: number[], timeoutMs = 30_000) {
	const deadline = Date.now() + timeoutMs;
	// Widened on purpose: the exit callback sets it, which TypeScript's narrowing cannot see.
	let exitCode = null as number | null;
	s.child.once('exit', (code) => (exitCode = code ?? -1));
	while (Date.now() < deadline) {
		const up = await Promise.all(ports.map((p) => portAnswers(p)));
		if (up.every(Boolean)) return;
		if (exitCode !== null)
			throw new Error(`${s.name} stand-in exited (code ${exitCode}) before listening`);
		await sleep(150);
	}
	throw new Error(
		`${s.name} stand-in did not listen on ${ports.join(', ')} within ${timeoutMs / 1000} s`
	);
}

/**
 * Starts every stand-in that is not already answering on its ports; returns the ones started
 * here (the caller stops those, and only those). A stand-in whose file is missing is reported
 * and skipped, so the rest of the product still runs.
 */
export async function startMocks(env: NodeJS.ProcessEnv = process.env): Promise<Started[]> {
	const started: Started[] = [];
	try {
		await Promise.all(
			mocks().map(async (m) => {
				const up = await Promise.all(m.ports.map((p) => portAnswers(p)));
				if (up.every(Boolean)) {
					console.log(
						`  ${m.name} stand-in already answering on ${m.ports.join(', ')}: reusing it`
					);
					return;
				}
				if (up.some(Boolean)) {
					throw new Error(
						`Port ${m.ports.join(' or ')} for the ${m.name} stand-in is taken by another program`
					);
				}
				if (!existsSync(path.join(ROOT, m.file))) {
					console.warn(`  ${m.file} does not exist yet: the ${m.name} stand-in is not running`);
					return;
				}
				const s = spawnTracked(m.name, BIN('tsx'), [m.file], { env, ports: m.ports });
				started.push(s);
				await waitForPorts(s, m.ports);
			})
		);
	} catch (err) {
		await stopAll(started);
		throw err;
	}
	return started;
}

/** SIGTERM, then SIGKILL after a grace period; resolves when every child has exited. */
export async function stopChild(s: Started, graceMs = 8000): Promise<void> {
	const { child } = s;
	if (child.exitCode !== null || child.signalCode !== null) return;
	const exited = new Promise<void>((r) => child.once('exit', () => r()));
	child.kill('SIGTERM');
	const timer = setTimeout(() => child.kill('SIGKILL'), graceMs);
	await exited;
	clearTimeout(timer);
	rmSync(s.pidFile, { force: true });
}

export async function stopAll(started: Started[]): Promise<void> {
	await Promise.all(started.map((s) => stopChild(s)));
}

/** Ends processes recorded in .data/run that are still alive (left by a run killed hard). */
export async function stopLeftovers(): Promise<string[]> {
	if (!existsSync(RUN_DIR)) return [];
	const stopped: string[] = [];
	for (const f of readdirSync(RUN_DIR)) {
		if (!f.endsWith('.pid')) continue;
		const file = path.join(RUN_DIR, f);
		const pid = Number(readFileSync(file, 'utf8').trim());
		rmSync(file, { force: true });
		// A pid can be reused after a reboot: only end processes that run from this project.
		if (!pid || !alive(pid) || !cmdline(pid).includes(ROOT)) continue;
		process.kill(pid, 'SIGTERM');
		for (let i = 0; i < 50 && alive(pid); i++) await sleep(100);
		if (alive(pid)) process.kill(pid, 'SIGKILL');
		stopped.push(f.replace(/\.pid$/, ''));
	}
	return stopped;
}

function cmdline(pid: number): string {
	try {
		return readFileSync(`/proc/${pid}/cmdline`, 'utf8').replace(/\0/g, ' ');
	} catch {
		return '';
	}
}

function alive(pid: number) {
	try {
		process.kill(pid, 0);
		return true;
	} catch {
		return false;
	}
}

/** Runs a command to completion with inherited output; resolves to its exit code. */
export function run(
	command: string,
	args: string[],
	env: NodeJS.ProcessEnv = process.env
): Promise<number> {
	return new Promise((resolve, reject) => {
		const child = spawn(command, args, { cwd: ROOT, env, stdio: 'inherit' });
		child.once('error', reject);
		child.once('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
	});
}
