/**
 * Which way imports point, read from the source tree: no file reaches itself through its imports
 * (type-only imports count: they still tie the files' meanings together), browser-safe code never
 * imports the server's, and the basket knows nothing of the orders built on it.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
	importCircles,
	importGraph,
	LIB,
	rel,
	resolveSpecifier,
	sourceFiles,
	specifiersIn,
	SRC
} from '../helpers/source-scan';

const graph = importGraph(sourceFiles(SRC));

describe('import arrows', () => {
	it('the scanner reads every kind of import and finds a circle when there is one', () => {
		// Its own check first, so an empty answer below means no circle, not a blind scanner.
		const text = [
			"import a from './a';",
			"import type { B } from '$lib/b';",
			"export { c } from '../c';",
			"import './d.css';",
			"type E = import('./e').E;",
			'import {\n\tf,\n\ttype G\n} from "./f";'
		].join('\n');
		expect(specifiersIn(text).sort()).toEqual(
			['$lib/b', '../c', './a', './d.css', './e', './f'].sort()
		);
		expect(resolveSpecifier(`${SRC}/routes/x.ts`, '$lib/server/db/retry')).toBe(
			`${LIB}/server/db/retry.ts`
		);
		const toy = new Map([
			['a', ['b']],
			['b', ['c']],
			['c', ['a']],
			['d', ['a']]
		]);
		expect(importCircles(toy)).toEqual([['a', 'b', 'c', 'a']]);
		expect(
			importCircles(
				new Map([
					['a', ['b']],
					['b', []]
				])
			)
		).toEqual([]);
	});

	it('no import circles in src', () => {
		expect(graph.size).toBeGreaterThan(100);
		expect(importCircles(graph).map((c) => c.map(rel).join(' → '))).toEqual([]);
	});

	it('nothing under src/lib outside server/ imports from $lib/server', () => {
		const offenders = [...graph.keys()]
			.filter((f) => f.startsWith(`${LIB}/`) && !f.startsWith(`${LIB}/server/`))
			.flatMap((f) =>
				specifiersIn(readFileSync(f, 'utf8'))
					.filter((s) => resolveSpecifier(f, s)?.startsWith(`${LIB}/server/`))
					.map((s) => `${rel(f)} imports ${s}`)
			);
		expect(offenders).toEqual([]);
	});

	it('the basket (cart) imports nothing from orders: orders are placed from a basket', () => {
		const inDomain = (f: string, d: string) =>
			f.startsWith(`${LIB}/${d}/`) || f.startsWith(`${LIB}/server/${d}/`);
		const offenders = [...graph]
			.filter(([f]) => inDomain(f, 'cart'))
			.flatMap(([f, to]) =>
				to.filter((t) => inDomain(t, 'orders')).map((t) => `${rel(f)} → ${rel(t)}`)
			);
		expect(offenders).toEqual([]);
	});
});
