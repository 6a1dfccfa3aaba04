/**
 * One way into a database transaction: `transact` / `inTx` in src/lib/server/db/retry.ts, which
 * run it again when InnoDB picks it as a deadlock victim or a lock wait times out. A bare
 * `db.transaction(` elsewhere would give a 500 under concurrent requests instead of a retry.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { rel, sourceFiles, SRC } from '../helpers/source-scan';

/** Server code: everything under src but the browser-safe $lib (IndexedDB has its own). */
const serverFiles = sourceFiles(SRC).filter(
	(f) => !rel(f).startsWith('src/lib/') || rel(f).startsWith('src/lib/server/')
);
const OPENS = /\.transaction\s*\(|\bbeginTransaction\b|\bstart\s+transaction\b/gi;

describe('one transaction helper', () => {
	it('the scan finds a transaction opened in each form it looks for', () => {
		const text =
			'db.transaction(async (tx) => {}); tx\n\t.transaction (x); conn.beginTransaction();';
		expect(text.match(OPENS)).toHaveLength(3);
		expect(readFileSync(`${SRC}/lib/server/db/retry.ts`, 'utf8').match(OPENS)).toHaveLength(1);
	});

	it('db.transaction( appears only in src/lib/server/db/retry.ts', () => {
		expect(serverFiles.length).toBeGreaterThan(100);
		const offenders = serverFiles
			.filter((f) => rel(f) !== 'src/lib/server/db/retry.ts')
			.flatMap((f) => (readFileSync(f, 'utf8').match(OPENS) ?? []).map((m) => `${rel(f)}: ${m}`));
		expect(offenders).toEqual([]);
	});
});
