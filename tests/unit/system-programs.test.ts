/**
 * Tests and scripts may call only programs that `.ci/run` makes sure of (mariadb-server's
 * programs, Debian's chromium, apt-get itself) or Node and npm packages. A program a developer
 * happens to have (pdftotext once) turns a green local run into a red CI on a fresh machine.
 * The list is in README.md ("What the tests need").
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = path.resolve(import.meta.dirname, '../..');
const ALLOWED = new Set([
	'apt-get',
	'mariadbd',
	'mariadb-install-db',
	'mariadb-admin',
	'mariadb-dump',
	'mariadb',
	'chromium',
	'/usr/bin/chromium',
	'/usr/sbin/mariadbd'
]);

function files(dir: string): string[] {
	return readdirSync(dir).flatMap((n) => {
		const p = path.join(dir, n);
		if (statSync(p).isDirectory()) return n === 'node_modules' ? [] : files(p);
		return /\.(ts|js|mjs)$/.test(n) ? [p] : [];
	});
}

const sources = ['tests', 'scripts', 'mocks'].flatMap((d) => files(path.join(ROOT, d)));
const self = path.join(ROOT, 'tests/unit/system-programs.test.ts');

describe('no test needs a program that .ci/run does not install', () => {
	it('reads some files', () => expect(sources.length).toBeGreaterThan(20));

	it('every program named in a spawn/exec call, which() or an absolute bin path is allowed', () => {
		const named: string[] = [];
		for (const f of sources) {
			if (f === self) continue;
			const text = readFileSync(f, 'utf8');
			for (const m of text.matchAll(
				/(?:spawn|spawnSync|execFile|execFileSync|exec|execSync|which|bin)\(\s*['"`]([^'"`]+)['"`]/g
			))
				named.push(`${path.relative(ROOT, f)}: ${m[1]}`);
			for (const m of text.matchAll(/['"`](\/(?:usr\/)?s?bin\/[\w.+-]+)/g))
				named.push(`${path.relative(ROOT, f)}: ${m[1]}`);
		}
		const refused = named.filter((n) => !ALLOWED.has(n.split(': ')[1]));
		expect(refused).toEqual([]);
	});

	// The private MariaDB of the restart and backup tests runs mariadb-server's own programs
	// (named through `bin(...)` and checked against the list above).
	const MARIADB_HELPER = path.join(ROOT, 'tests/helpers/private-mariadb.ts');

	it('no end-to-end or unit test shells out, except to start the built app with Node', () => {
		const offenders = sources
			.filter(
				// Relative to the project: a checkout inside a folder named `tests` holds every file.
				(f) =>
					path.relative(ROOT, f).startsWith(`tests${path.sep}`) &&
					f !== self &&
					f !== MARIADB_HELPER
			)
			.filter((f) => /node:child_process|from 'child_process'/.test(readFileSync(f, 'utf8')))
			.filter((f) => !/process\.execPath/.test(readFileSync(f, 'utf8')));
		expect(offenders.map((f) => path.relative(ROOT, f))).toEqual([]);
	});
});
