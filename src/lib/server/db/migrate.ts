import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { drizzle } from 'drizzle-orm/mysql2';
import { migrate } from 'drizzle-orm/mysql2/migrator';
import mysql from 'mysql2/promise';

/**
 * The committed migrations, by absolute path: drizzle's migrator would otherwise read
 * `drizzle/` relative to the working directory. Used by scripts and tests (run through tsx or
 * vitest, where this file keeps its place in the tree), not by the built app.
 */
export const MIGRATIONS_FOLDER = path.resolve(
	path.dirname(fileURLToPath(import.meta.url)),
	'../../../../drizzle'
);

/** Applies every migration not yet recorded in the database at `url`. */
export async function runMigrations(url: string): Promise<void> {
	const conn = await mysql.createConnection({ uri: url, multipleStatements: true });
	try {
		await migrate(drizzle(conn), { migrationsFolder: MIGRATIONS_FOLDER });
	} finally {
		await conn.end();
	}
}
