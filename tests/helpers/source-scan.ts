/**
 * Reading the source tree for the rule tests: every .ts and .svelte file under a folder, the
 * module specifiers each one imports (type-only imports, re-exports and dynamic imports too) and
 * where a `$lib/` or relative specifier lands on disk.
 */
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';

export const ROOT = path.resolve(import.meta.dirname, '../..');
export const SRC = path.join(ROOT, 'src');
export const LIB = path.join(SRC, 'lib');

/** Every .ts and .svelte file under `dir`, absolute paths. */
export function sourceFiles(dir: string): string[] {
	return readdirSync(dir).flatMap((n) => {
		const p = path.join(dir, n);
		return statSync(p).isDirectory() ? sourceFiles(p) : /\.(ts|svelte)$/.test(n) ? [p] : [];
	});
}

/** The path from the project root, with forward slashes. */
export const rel = (p: string) => path.relative(ROOT, p).split(path.sep).join('/');

const SPECIFIER = [
	/\b(?:import|export)\s+(?:type\s+)?[\w*\s{},$]*?\bfrom\s*['"]([^'"]+)['"]/g, // import x from, export { } from
	/\bimport\s*['"]([^'"]+)['"]/g, // import 'side-effect'
	/\bimport\s*\(\s*['"]([^'"]+)['"]\s*\)/g // import('dynamic'), import('x').Type
];

/** Every module specifier in a file's text. */
export function specifiersIn(text: string): string[] {
	const out = new Set<string>();
	for (const re of SPECIFIER) for (const m of text.matchAll(re)) out.add(m[1]);
	return [...out];
}

const CANDIDATES = ['', '.ts', '.svelte.ts', '.js', '/index.ts'];

/**
 * Where a specifier lands: a file under src for `$lib/…` and relative paths (a `.js` ending
 * read as its `.ts`), null for packages, `$app`, `$env`, SvelteKit's generated `./$types` and
 * anything outside the tree.
 */
export function resolveSpecifier(from: string, spec: string): string | null {
	let base: string;
	if (spec === '$lib' || spec.startsWith('$lib/')) base = path.join(LIB, spec.slice(4));
	else if (spec.startsWith('.')) base = path.resolve(path.dirname(from), spec);
	else return null;
	if (/\/\$types$/.test(spec)) return null;
	const stem = base.replace(/\.js$/, '');
	for (const c of CANDIDATES.map((x) => stem + x)) {
		if (existsSync(c) && statSync(c).isFile()) return c;
	}
	return null;
}

/** File → the source files it imports (only those that resolve inside the tree). */
export function importGraph(files: string[]): Map<string, string[]> {
	const graph = new Map<string, string[]>();
	for (const f of files) {
		const text = readFileSync(f, 'utf8');
		const to = specifiersIn(text)
			.map((s) => resolveSpecifier(f, s))
			.filter((t): t is string => t !== null && t !== f);
		graph.set(f, [...new Set(to)]);
	}
	return graph;
}

/**
 * Every import circle, each as the list of files around it (first file repeated at the end).
 * Depth-first search with the usual three colours: reaching a file still on the stack closes a
 * circle.
 */
export function importCircles(graph: Map<string, string[]>): string[][] {
	const state = new Map<string, 'open' | 'done'>();
	const stack: string[] = [];
	const circles: string[][] = [];
	const visit = (f: string) => {
		state.set(f, 'open');
		stack.push(f);
		for (const t of graph.get(f) ?? []) {
			const s = state.get(t);
			if (s === 'open') circles.push([...stack.slice(stack.indexOf(t)), t]);
			else if (s === undefined) visit(t);
		}
		stack.pop();
		state.set(f, 'done');
	};
	for (const f of [...graph.keys()].sort()) if (!state.has(f)) visit(f);
	return circles;
}
