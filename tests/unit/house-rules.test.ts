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

	it('unit tests reach a test database, never the demo shop (tests/unit/helpers/test-database.ts)', () => {
		expect(new URL(config.db.url).pathname).toMatch(/test/);
	});
});
