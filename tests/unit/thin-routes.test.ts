import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

/**
 * Routes stay thin: a route's server file parses, authorises, calls a module in $lib/server and
 * returns. Eighty lines holds that for every route we have; a file that grows past it is doing
 * the domain's work and is split (the logic to $lib, the I/O to $lib/server).
 */
const BUDGET = 80;
const root = path.resolve(__dirname, '../../src/routes');

function walk(dir: string): string[] {
	if (!existsSync(dir)) return [];
	return readdirSync(dir).flatMap((name) => {
		const p = path.join(dir, name);
		return statSync(p).isDirectory() ? walk(p) : [p];
	});
}

const isServerFile = (p: string) => /\+(page|layout)\.server\.ts$|\+server\.ts$/.test(p);
const lineCount = (src: string) => src.replace(/\n$/, '').split('\n').length;
const files = walk(root)
	.filter(isServerFile)
	.map((f) => ({
		name: path.relative(root, f).split(path.sep).join('/'),
		lines: lineCount(readFileSync(f, 'utf8'))
	}));

describe(`route server files stay within ${BUDGET} lines`, () => {
	it('finds the route files (so a moved tree cannot pass by being empty)', () => {
		const names = files.map((f) => f.name);
		expect(names).toContain('(shop)/shop/[slug]/+page.server.ts');
		expect(names).toContain('workshop/pieces/[id]/+page.server.ts');
		expect(files.length).toBeGreaterThan(40);
	});

	it('every +page.server.ts, +layout.server.ts and +server.ts is at most the budget', () => {
		const over = files.filter((f) => f.lines > BUDGET).map((f) => `${f.name}: ${f.lines} lines`);
		expect(over).toEqual([]);
	});

	it('counts lines as an editor shows them (self-check)', () => {
		expect(lineCount('a\nb\n')).toBe(2);
		expect(lineCount('a\nb')).toBe(2);
		expect(lineCount('a\n\nb\n')).toBe(3);
	});
});
