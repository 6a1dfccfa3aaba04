/**
 * What `npm start` and `npm run dev` share: MariaDB up, stand-ins up, migrations applied, demo
 * seeded when the database is empty, and a clean stop of whatever this run started.
 */
import { config } from '../../config/settings';
import { runMigrations } from '../../src/lib/server/db/migrate';
import { ensureMariadb, releaseMariadb, type MariadbHandle } from './mariadb';
import { startMocks, stopAll, type Started } from './services';

export type Running = {
	mariadb: MariadbHandle | null;
	mocks: Started[];
	children: Started[];
	/** Set once stopping has begun, so children exiting on the same Ctrl-C are not a crash. */
	stopping?: boolean;
};

export async function bringUp(): Promise<Running> {
	const running: Running = { mariadb: null, mocks: [], children: [] };
	try {
		running.mariadb = await ensureMariadb();
		running.mocks = await startMocks();
		await runMigrations(config.db.url);
		// Imported late: the seed pulls in the password hasher and the photo step.
		const { seedDemoAt } = await import('../seed/demo');
		if (await seedDemoAt(config.db.url)) console.log('Demo data seeded (the database was empty).');
	} catch (err) {
		await bringDown(running);
		throw err;
	}
	return running;
}

/** Stops the app and stand-ins this run started, then MariaDB if this run started it. */
export async function bringDown(running: Running): Promise<void> {
	running.stopping = true;
	await stopAll(running.children);
	running.children = [];
	await stopAll(running.mocks);
	running.mocks = [];
	if (running.mariadb) {
		const m = running.mariadb;
		running.mariadb = null;
		if (await releaseMariadb(m)) console.log('MariaDB stopped.');
	}
}

/**
 * Ctrl-C / SIGTERM: stop everything once, then exit. Ctrl-C reaches this process twice (from the
 * terminal and relayed by tsx), so only a second signal seconds later means "exit now".
 */
export function stopOnSignals(running: Running) {
	let firstAt = 0;
	const handler = (sig: NodeJS.Signals) => {
		if (firstAt) {
			if (Date.now() - firstAt > 3000) process.exit(130);
			return;
		}
		firstAt = Date.now();
		console.log(`\n${sig}: stopping what this run started…`);
		bringDown(running)
			.catch((err) => console.error(String(err)))
			.finally(() => process.exit(0));
	};
	process.on('SIGINT', handler);
	process.on('SIGTERM', handler);
	process.on('SIGHUP', handler);
}

export function banner(appUrl: string) {
	return import('../seed/demo').then(({ DEMO_ACCOUNTS }) => {
		const w = Math.max(...DEMO_ACCOUNTS.map((a) => a.email.length));
		const lines = [
			'',
			'Chipstall is running. Open it at this one address:',
			'',
			`    ${appUrl}`,
			'',
			'  (use exactly this one: forms are only accepted from it)',
			`  Shop          ${appUrl}/shop`,
			`  Workshop      ${appUrl}/workshop`,
			`  Mail inbox    http://127.0.0.1:${config.mail.inboxPort}/   (every e-mail the app sends lands here)`,
			process.env.DATABASE_URL
				? '  Database      DATABASE_URL'
				: `  MariaDB       127.0.0.1:${config.db.port}, database ${config.db.name}`,
			'',
			'Demo accounts (demo-only passwords):',
			...DEMO_ACCOUNTS.map((a) => `  ${a.role.padEnd(9)} ${a.email.padEnd(w)}  ${a.password}`),
			'',
			'Press Ctrl-C to stop.'
		];
		console.log(lines.join('\n'));
	});
}
