/**
 * `npm run restore <folder>`: loads `<folder>/database.sql` into the configured database (which
 * must be empty: create it first) and uploads `<folder>/photos` to the photo bucket.
 */
import path from 'node:path';
import { config } from '../config/settings';
import { restore } from './lib/backup';
import { ensureMariadb, releaseMariadb } from './lib/mariadb';
import { startMocks, stopAll } from './lib/services';

const from = process.argv[2];
if (!from) {
	console.error('Usage: npm run restore <backup folder>');
	process.exit(1);
}
const db = await ensureMariadb();
const mocks = await startMocks();
try {
	const { photos } = await restore(config.db.url, path.resolve(from));
	console.log(`Restored database ${config.db.name} and ${photos} photo files from ${from}`);
} finally {
	await stopAll(mocks);
	await releaseMariadb(db);
}
