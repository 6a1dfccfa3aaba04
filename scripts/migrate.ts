/** `npm run db:migrate`: starts the project's MariaDB if needed and applies drizzle/. */
import { config } from '../config/settings';
import { runMigrations } from '../src/lib/server/db/migrate';
import { ensureMariadb, releaseMariadb } from './lib/mariadb';

const handle = await ensureMariadb();
try {
	await runMigrations(config.db.url);
	console.log(`Migrations applied to ${config.db.name}.`);
} finally {
	await releaseMariadb(handle);
}
