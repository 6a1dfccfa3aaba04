/**
 * Rules that README.md and DEVELOPERS.md state about where code lives, kept by reading the
 * source tree.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { config } from '$lib/server/config';

const ROOT = path.resolve(import.meta.dirname, '../..');

function files(dir: string): string[] {
	return readdirSync(dir).flatMap((n) => {
		const p = path.join(dir, n);
		return statSync(p).isDirectory() ? files(p) : /\.(ts|svelte)$/.test(n) ? [p] : [];
	});
}

const rel = (p: string) => path.relative(ROOT, p);
const importsOf = (p: string) =>
	[...readFileSync(p, 'utf8').matchAll(/\bfrom\s+['"]([^'"]+)['"]/g)].map((m) => m[1]);

describe('house rules', () => {
	const src = files(path.join(ROOT, 'src'));

	it('lucia (deprecated upstream) is imported only inside src/lib/server/auth/', () => {
		const outside = src
			.filter((f) => importsOf(f).some((i) => i === 'lucia' || i.startsWith('@lucia-auth/')))
			.map(rel)
			.filter((f) => !f.startsWith('src/lib/server/auth/'));
		expect(outside).toEqual([]);
	});

	it('no route file imports the database module: routes call a domain module', () => {
		const routes = src.filter((f) => rel(f).startsWith('src/routes/'));
		const offenders = routes
			.filter((f) => importsOf(f).some((i) => /(^\$lib\/server\/db)|(\/server\/db(\/|$))/.test(i)))
			.map(rel);
		expect(offenders).toEqual([]);
	});

	it('vitest reaches a test database, never the demo shop (tests/helpers/test-database.ts)', () => {
		expect(new URL(config.db.url).pathname).toMatch(/^\/chipstall_test(_\w+)?$/);
	});
});

describe('test layout', () => {
	const tests = files(path.join(ROOT, 'tests')).map(rel);
	const vitest = tests.filter((f) => /^tests\/(unit|db)\//.test(f));
	const playwright = tests.filter((f) => f.startsWith('tests/e2e/'));
	const appByPath = (f: string) =>
		importsOf(path.join(ROOT, f)).filter((i) => /(^|\/)src\/lib(\/|$)/.test(i));

	it('finds the three folders', () => {
		expect(vitest.filter((f) => f.startsWith('tests/unit/')).length).toBeGreaterThan(20);
		expect(vitest.filter((f) => f.startsWith('tests/db/')).length).toBeGreaterThan(20);
		expect(playwright.length).toBeGreaterThan(20);
	});

	it('helpers live in tests/helpers only', () => {
		const strays = tests.filter(
			(f) => /(^|\/)helpers\//.test(f) && !f.startsWith('tests/helpers/')
		);
		expect(strays).toEqual([]);
	});

	it('vitest files import app code through $lib, never by a path into src/lib', () => {
		expect(vitest.filter((f) => appByPath(f).length > 0)).toEqual([]);
	});

	it('Playwright specs use relative imports: no $lib, which only vite knows', () => {
		const withAlias = playwright.filter((f) =>
			importsOf(path.join(ROOT, f)).some((i) => i.startsWith('$lib'))
		);
		expect(withAlias).toEqual([]);
	});

	// A test file that reaches MariaDB (the database module, the shared row fixtures, the payment
	// fixture, a private server or mysql2 itself) is a database test: it lives in tests/db.
	it('tests/unit holds no test that imports the database', () => {
		const dbImport =
			/^(\$lib\/server\/db(\/pool)?|mysql2(\/promise)?|\.\.\/helpers\/(fixtures|payment-fixture|private-mariadb))$/;
		const offenders = vitest
			.filter((f) => f.startsWith('tests/unit/'))
			.filter((f) => {
				const text = readFileSync(path.join(ROOT, f), 'utf8');
				const dynamic = [...text.matchAll(/import\(\s*['"]([^'"]+)['"]\s*\)/g)].map((m) => m[1]);
				return [...importsOf(path.join(ROOT, f)), ...dynamic].some((i) => dbImport.test(i));
			});
		expect(offenders).toEqual([]);
	});
});
