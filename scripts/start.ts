/**
 * `npm start`: MariaDB and the stand-ins up, migrations applied, demo seeded when the database is
 * empty, the app built when `build/` is missing or older than its sources, then `node build`.
 * Ctrl-C stops what this run started.
 */
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { config } from '../config/settings';
import { banner, bringDown, bringUp, stopOnSignals } from './lib/bootstrap';
import { BIN, ROOT } from './lib/paths';
import { portAnswers, run, spawnTracked } from './lib/services';

const t0 = Date.now();
const port = config.port;
process.env.PORT = String(port);
process.env.ORIGIN = config.origin;
// Room for photo uploads (adapter-node's default request body limit is 512 kB).
// As large as the most the app drains after an early answer (DRAIN_LIMIT in body-limit.ts), so a
// refused body up to that size is read and thrown away and the client reads the 413.
process.env.BODY_SIZE_LIMIT ??= '32M';

const BUILD_DIR = path.join(ROOT, 'build');
const SOURCES = [
	'src',
	'static',
	'svelte.config.js',
	'vite.config.ts',
	'tailwind.config.ts',
	'package.json'
];

function newestMtime(p: string): number {
	if (!existsSync(p)) return 0;
	const s = statSync(p);
	if (!s.isDirectory()) return s.mtimeMs;
	return readdirSync(p).reduce((m, f) => Math.max(m, newestMtime(path.join(p, f))), s.mtimeMs);
}

function buildIsStale(): boolean {
	const entry = path.join(BUILD_DIR, 'index.js');
	if (!existsSync(entry)) return true;
	const built = statSync(entry).mtimeMs;
	return SOURCES.some((s) => newestMtime(path.join(ROOT, s)) > built);
}

if (await portAnswers(port)) {
	console.error(
		`Port ${port} is already in use (another Chipstall?). Stop it, or set PORT to a free port.`
	);
	process.exit(1);
}

const running = await bringUp().catch((err) => {
	console.error(err instanceof Error ? err.message : err);
	process.exit(1);
});
stopOnSignals(running);

if (buildIsStale()) {
	console.log('Building the app (the build is missing or older than the sources)…');
	// Always into build/: the test command's own folders are not for serving.
	const env = { ...process.env, CHIPSTALL_BUILD_DIR: '', CHIPSTALL_KIT_DIR: '' };
	if ((await run(BIN('vite'), ['build', '--logLevel', 'warn'], env)) !== 0) {
		console.error('The build failed; see above.');
		await bringDown(running);
		process.exit(1);
	}
}

const app = spawnTracked('app', process.execPath, [BUILD_DIR], { ports: [port] });
running.children.push(app);
app.child.once('exit', (code, signal) => {
	// The app stopped on its own (a crash, or killed): take the rest down too.
	if (running.stopping) return;
	running.children = [];
	console.error(`The app exited (${signal ?? code}); stopping the rest.`);
	void bringDown(running).finally(() => process.exit(code || 1));
});

const deadline = Date.now() + 30_000;
while (!(await portAnswers(port))) {
	if (Date.now() > deadline) {
		console.error(`The app did not listen on port ${port} within 30 s.`);
		await bringDown(running);
		process.exit(1);
	}
	await new Promise((r) => setTimeout(r, 150));
}
await banner(config.origin);
console.log(`(ready in ${((Date.now() - t0) / 1000).toFixed(1)} s)`);
