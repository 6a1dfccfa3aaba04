/**
 * Every way into the app, read from the route tree itself (src/routes/**): each page (GET), each
 * form action (POST ?/name) and each method a +server.ts exports. The access matrix test checks
 * this list against its expectations, so a route added later cannot go untested.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';

const ROUTES = path.resolve(import.meta.dirname, '../../src/routes');
const METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'];

export type Entry = {
	/** e.g. `GET /shop/[slug]`, `POST /cart?/remove`, `POST /signin` (default action). */
	key: string;
	method: string;
	/** Route id with (groups) removed, e.g. `/workshop/orders/[ref]`. */
	route: string;
	kind: 'page' | 'action' | 'endpoint';
	/** Action name, undefined for the default action. */
	action?: string;
};

function routeId(dir: string): string {
	const parts = path
		.relative(ROUTES, dir)
		.split(path.sep)
		.filter((p) => p && !/^\(.*\)$/.test(p));
	return '/' + parts.join('/');
}

/** Named keys of `export const actions = { … }` (one tab in), `default` included. */
export function actionNames(source: string): string[] {
	const start = source.search(/export const actions\b/);
	if (start < 0) return [];
	const names: string[] = [];
	for (const m of source.slice(start).matchAll(/^\t(?:'([^']+)'|([A-Za-z_$][\w$]*))\s*:/gm)) {
		names.push(m[1] ?? m[2]);
	}
	return names;
}

export function endpointMethods(source: string): string[] {
	return METHODS.filter((m) =>
		new RegExp(`export\\s+(const|async function|function)\\s+${m}\\b`).test(source)
	);
}

export function routeEntries(root = ROUTES): Entry[] {
	const out: Entry[] = [];
	const walk = (dir: string) => {
		const files = readdirSync(dir);
		const route = routeId(dir);
		if (files.includes('+page.svelte')) {
			out.push({ key: `GET ${route}`, method: 'GET', route, kind: 'page' });
		}
		if (files.includes('+page.server.ts')) {
			for (const name of actionNames(readFileSync(path.join(dir, '+page.server.ts'), 'utf8'))) {
				const action = name === 'default' ? undefined : name;
				const key = `POST ${route}${action ? `?/${action}` : ''}`;
				out.push({ key, method: 'POST', route, kind: 'action', action });
			}
		}
		if (files.includes('+server.ts')) {
			for (const method of endpointMethods(readFileSync(path.join(dir, '+server.ts'), 'utf8'))) {
				out.push({ key: `${method} ${route}`, method, route, kind: 'endpoint' });
			}
		}
		for (const f of files) {
			const p = path.join(dir, f);
			if (statSync(p).isDirectory()) walk(p);
		}
	};
	walk(root);
	return out.sort((a, b) => a.key.localeCompare(b.key));
}
