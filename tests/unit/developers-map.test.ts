/**
 * DEVELOPERS.md's "Where things live" table is the newcomer's map from a feature to its folders.
 * These checks keep it true: every folder it names exists, every domain folder is in it, and the
 * routes it points at are there.
 */
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = path.resolve(import.meta.dirname, '../..');
const text = readFileSync(path.join(ROOT, 'DEVELOPERS.md'), 'utf8');
const section = text.slice(text.indexOf('## Where things live'));
const rows = section
	.slice(0, section.indexOf('\n## ') > 0 ? section.indexOf('\n## ') : undefined)
	.split('\n')
	.filter((l) => l.startsWith('| ') && !l.startsWith('| feature') && !l.startsWith('| ---'))
	.map((l) => l.split('|').map((c) => c.trim()));

/** The backticked names in one cell (a parenthesis after a name is its description). */
const names = (cell: string) =>
	[...cell.replace(/\([^)]*\)/g, '').matchAll(/`([^`]+)`/g)].map((m) => m[1]);
const folders = (dir: string) =>
	readdirSync(dir).filter((f) => statSync(path.join(dir, f)).isDirectory() && f !== 'server');

const lib = rows.flatMap((r) => names(r[2]));
const server = rows.flatMap((r) => names(r[3]));

describe('the map in DEVELOPERS.md', () => {
	it('has a row for every feature listed', () => {
		expect(rows.length).toBeGreaterThan(15);
	});

	it('names only folders that exist', () => {
		for (const f of lib)
			expect(existsSync(path.join(ROOT, 'src/lib', f)), `src/lib/${f}`).toBe(true);
		for (const f of server)
			expect(existsSync(path.join(ROOT, 'src/lib/server', f)), `src/lib/server/${f}`).toBe(true);
	});

	it('lists every folder of src/lib and src/lib/server', () => {
		for (const f of folders(path.join(ROOT, 'src/lib')))
			expect(lib, `src/lib/${f}`).toContain(`${f}/`);
		for (const f of folders(path.join(ROOT, 'src/lib/server')))
			expect(server, `src/lib/server/${f}`).toContain(`${f}/`);
	});

	it('points at routes that exist', () => {
		for (const r of rows.flatMap((row) => [...row[4].matchAll(/`([^`]+)`/g)].map((m) => m[1]))) {
			if (r.startsWith('…') || r.startsWith('src/')) continue;
			expect(existsSync(path.join(ROOT, 'src/routes', r)), `src/routes/${r}`).toBe(true);
		}
	});

	it('leaves no loose files in src/lib or src/lib/server but the config', () => {
		const loose = (dir: string) =>
			readdirSync(dir).filter((f) => statSync(path.join(dir, f)).isFile());
		expect(loose(path.join(ROOT, 'src/lib'))).toEqual([]);
		expect(loose(path.join(ROOT, 'src/lib/server'))).toEqual(['config.ts']);
	});

	it('has no file beside a folder of the same name', () => {
		const walk = (dir: string): string[] =>
			readdirSync(dir).flatMap((f) => {
				const p = path.join(dir, f);
				if (!statSync(p).isDirectory()) return [];
				const twins = readdirSync(dir).filter(
					(g) => g !== f && g.replace(/\.(svelte\.)?ts$/, '') === f
				);
				return [...twins.map((t) => path.join(dir, t)), ...walk(p)];
			});
		expect(walk(path.join(ROOT, 'src'))).toEqual([]);
	});
});
