/**
 * `npm run backup [folder]`: a consistent dump of the database (mariadb-dump
 * --single-transaction) and a copy of every photo, into `folder` (default
 * `.data/backups/<date-time>`). Restore with `npm run restore <folder>` (see README).
 */
import path from 'node:path';
import { config } from '../config/settings';
import { backup } from './lib/backup';
import { ensureMariadb, releaseMariadb } from './lib/mariadb';
import { DATA_DIR } from './lib/paths';
import { startMocks, stopAll } from './lib/services';

const dir = path.resolve(
	process.argv[2] ?? path.join(DATA_DIR, 'backups', new Date().toISOString().replace(/[:.]/g, '-'))
);
const db = await ensureMariadb();
const mocks = await startMocks();
try {
	const { photos } = await backup(config.db.url, dir);
	console.log(`Backed up database ${config.db.name} and ${photos} photo files to ${dir}`);
} finally {
	await stopAll(mocks);
	await releaseMariadb(db);
}
