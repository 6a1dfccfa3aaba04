/** `npm run stop`: ends anything a start, dev or test run left behind, then the project's MariaDB. */
import { MARIADB, stopMariadb, usesExternalDatabase } from './lib/mariadb';
import { stopLeftovers } from './lib/services';
import { rmSync } from 'node:fs';

const left = await stopLeftovers();
if (left.length) console.log(`Stopped: ${left.join(', ')}`);
if (usesExternalDatabase()) {
	console.log('DATABASE_URL is set: the server it points at is not ours to stop.');
} else if (await stopMariadb()) {
	rmSync(MARIADB.usersDir, { recursive: true, force: true });
	console.log('MariaDB stopped.');
} else {
	console.log('MariaDB was not running.');
}
