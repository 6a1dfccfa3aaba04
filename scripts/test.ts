/**
 * `npm test` — vitest (tests/unit, pure, and tests/db, against MariaDB) then end-to-end tests
 * (Playwright, tests/e2e). `npm test -- unit [vitest args]` or `npm test -- e2e [playwright args]`
 * runs one half.
 *
 * Starts MariaDB and the stand-ins on test ports of their own (so a running `npm start` does
 * not clash), uses a fresh database each run (TEST_DB_NAME, default chipstall_test; any name not
 * starting chipstall_test is refused before anything is dropped), builds the app into a folder of
 * its own and stops everything it started. The exit code is the failures'.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, rmSync } from 'node:fs';
import path from 'node:path';
import mysql from 'mysql2/promise';
import {
	adminConnection,
	databaseUrl,
	ensureMariadb,
	releaseMariadb,
	type MariadbHandle
} from './lib/mariadb';
import { BIN, DATA_DIR, ROOT } from './lib/paths';
import { freePort, run, startMocks, stopAll, type Started } from './lib/services';
import { testDatabaseName } from './lib/test-database';

const args = process.argv.slice(2);
const part = args[0] === 'unit' || args[0] === 'e2e' ? args.shift()! : 'all';
const t0 = Date.now();

const e = process.env;
let testDb: string;
try {
	testDb = testDatabaseName(e);
} catch (err) {
	console.error((err as Error).message);
	process.exit(1);
}
/**
 * Test ports for the stand-ins and the app. TEST_* pins one; otherwise a default that another
 * run holds is swapped for a free port, so runs in other checkouts do not collide.
 */
const testPort = async (pinned: string | undefined, preferred: number) =>
	pinned ? Number(pinned) : freePort(preferred);
const appPort = await testPort(e.TEST_APP_PORT, 3100);
const s3Port = await testPort(e.TEST_S3_PORT, 4669);
Object.assign(e, {
	SMTP_HOST: '127.0.0.1',
	SMTP_PORT: String(await testPort(e.TEST_SMTP_PORT, 2625)),
	MAIL_INBOX_PORT: String(await testPort(e.TEST_INBOX_PORT, 8125)),
	S3_PORT: String(s3Port),
	S3_ENDPOINT: `http://127.0.0.1:${s3Port}`,
	STRIPE_API_HOST: '127.0.0.1',
	STRIPE_API_PORT: String(await testPort(e.TEST_STRIPE_PORT, 12211)),
	STRIPE_API_PROTOCOL: 'http',
	PORT: String(appPort),
	ORIGIN: `http://localhost:${appPort}`,
	DB_NAME: testDb,
	CHIPSTALL_BUILD_DIR: path.join(DATA_DIR, 'test-build', testDb, 'app'),
	S3_DIR: path.join(DATA_DIR, 'test-build', testDb, 's3')
});

function ensureChromium() {
	const chromium = e.CHROMIUM_PATH || '/usr/bin/chromium';
	if (existsSync(chromium)) return;
	if (process.getuid?.() !== 0) {
		throw new Error(`${chromium} is missing: install it with \`sudo apt-get install -y chromium\``);
	}
	console.log('Installing chromium with apt (one time)…');
	const env = { ...e, DEBIAN_FRONTEND: 'noninteractive' };
	for (const a of [['update'], ['install', '-y', '--no-install-recommends', 'chromium']]) {
		if (spawnSync('apt-get', a, { stdio: 'inherit', env }).status !== 0)
			throw new Error(`apt-get ${a.join(' ')} failed`);
	}
}

/** Drops and recreates the test database, applies the migrations, optionally seeds the demo. */
async function freshDatabase(url: string, seed: boolean) {
	const admin = await adminConnection();
	try {
		await admin.query(`DROP DATABASE IF EXISTS ${mysql.escapeId(testDb)}`);
		await admin.query(
			`CREATE DATABASE ${mysql.escapeId(testDb)} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`
		);
	} finally {
		await admin.end();
	}
	const { runMigrations } = await import('../src/lib/server/db/migrate');
	await runMigrations(url);
	if (seed) {
		const { seedDemoAt } = await import('./seed/demo');
		await seedDemoAt(url);
	}
}

let mariadb: MariadbHandle | null = null;
let mocks: Started[] = [];
let exitCode = 1;
const timings: string[] = [];
const lap = (label: string, since: number) =>
	timings.push(`${label} ${((Date.now() - since) / 1000).toFixed(1)} s`);

let cleaning: Promise<void> | null = null;
const cleanUp = () => (cleaning ??= stopEverything());

async function stopEverything() {
	await stopAll(mocks);
	mocks = [];
	if (mariadb) {
		const m = mariadb;
		mariadb = null;
		await releaseMariadb(m).catch((err) => console.error(String(err)));
	}
}

// Ctrl-C arrives twice (terminal and tsx's relay): stop once, exit when done.
for (const sig of ['SIGINT', 'SIGTERM'] as const) {
	process.on(sig, () => {
		void cleanUp().finally(() => process.exit(130));
	});
}

try {
	if (part !== 'unit') ensureChromium();
	let t = Date.now();
	mariadb = await ensureMariadb();
	const url = databaseUrl(testDb);
	const env = { ...e, DATABASE_URL: url };
	// A fresh photo store each run, like the database.
	rmSync(e.S3_DIR!, { recursive: true, force: true });
	mocks = await startMocks(env);
	lap('services', t);

	// tsconfig.json extends the default kit folder's tsconfig, whose paths give tsx the `$lib`
	// alias the migrations and the seed import through; a fresh checkout has none yet.
	if (!existsSync(path.join(ROOT, '.svelte-kit', 'tsconfig.json')))
		await run(BIN('svelte-kit'), ['sync'], env);

	let failed = false;
	if (part !== 'e2e') {
		t = Date.now();
		await freshDatabase(url, true);
		const code = await run(BIN('vitest'), ['run', ...args], env);
		lap('unit', t);
		if (code !== 0) failed = true;
	}
	if (part !== 'unit') {
		t = Date.now();
		// Its own kit folder too, so a build here never clashes with `npm start` or another run.
		const kitDir = path.join(DATA_DIR, 'test-build', testDb, 'kit');
		const buildCode = await run(BIN('vite'), ['build', '--logLevel', 'warn'], {
			...env,
			CHIPSTALL_KIT_DIR: kitDir
		});
		lap('build', t);
		if (buildCode !== 0) {
			failed = true;
		} else {
			t = Date.now();
			await freshDatabase(url, true);
			const code = await run(BIN('playwright'), ['test', ...args], env);
			lap('e2e', t);
			if (code !== 0) failed = true;
		}
	}
	exitCode = failed ? 1 : 0;
} catch (err) {
	console.error(err instanceof Error ? err.message : err);
	exitCode = 1;
} finally {
	await cleanUp();
}
console.log(
	`\n${exitCode === 0 ? 'Tests passed' : 'Tests FAILED'} (${timings.join(', ')}; total ${((Date.now() - t0) / 1000).toFixed(0)} s)`
);
process.exit(exitCode);
