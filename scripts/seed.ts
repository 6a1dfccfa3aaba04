/** `npx tsx scripts/seed.ts`: seeds the demo scenario into an empty database (after migrating). */
import { config } from '../config/settings';
import { runMigrations } from '../src/lib/server/db/migrate';
import { seedDemoAt } from './seed/demo';
import { ensureMariadb, releaseMariadb } from './lib/mariadb';

const handle = await ensureMariadb();
try {
	await runMigrations(config.db.url);
	const seeded = await seedDemoAt(config.db.url);
	console.log(
		seeded
			? `Demo data seeded into ${config.db.name}.`
			: `${config.db.name} already has pieces: left as it is.`
	);
} finally {
	await releaseMariadb(handle);
}
