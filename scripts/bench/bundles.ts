/**
 * JavaScript and CSS each page ships, in gzip bytes, counted from the build's own manifest:
 * the client entry (start + app and their imports) plus, for the route, the `imports` and
 * `stylesheets` of each layout node and the leaf node SvelteKit preloads for it.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';

export type PageWeight = { route: string; jsGzip: number; cssGzip: number; files: number };

const list = (src: string, name: string): string[] => {
	const m = src.match(new RegExp(`export const ${name} = (\\[[^\\]]*\\])`));
	return m ? (JSON.parse(m[1]) as string[]) : [];
};

/** `kitDir` is the build's kit output folder (svelte.config `outDir`), `clientDir` its client files. */
export function pageWeights(kitDir: string, clientDir: string, routes: string[]): PageWeight[] {
	const server = path.join(kitDir, 'output', 'server');
	const manifest = readFileSync(path.join(server, 'manifest.js'), 'utf8');
	const entry = manifest.match(/client: *\{[^}]*imports: *(\[[^\]]*\])/);
	const entryFiles = entry ? (JSON.parse(entry[1]) as string[]) : [];
	const node = (i: number) => {
		const src = readFileSync(path.join(server, 'nodes', `${i}.js`), 'utf8');
		return { js: list(src, 'imports'), css: list(src, 'stylesheets') };
	};
	const gz = (f: string) => gzipSync(readFileSync(path.join(clientDir, f)), { level: 9 }).length;

	return routes.map((route) => {
		const at = manifest.indexOf(`id: "${route}",`);
		if (at < 0) throw new Error(`route ${route} is not in the build`);
		const page = manifest
			.slice(at)
			.match(/page: \{ layouts: \[([^\]]*)\], errors: [^,]*,*\], leaf: (\d+) \}/);
		if (!page) throw new Error(`route ${route} has no page`);
		const ids = [...page[1].split(',').filter(Boolean).map(Number), Number(page[2])];
		const js = new Set(entryFiles);
		const css = new Set<string>();
		for (const i of ids) {
			const n = node(i);
			n.js.forEach((f) => js.add(f));
			n.css.forEach((f) => css.add(f));
		}
		const sum = (s: Set<string>) => [...s].reduce((t, f) => t + gz(f), 0);
		return { route, jsGzip: sum(js), cssGzip: sum(css), files: js.size + css.size };
	});
}
