import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

/**
 * Every workshop load, action and endpoint must check the role where it touches data
 * (a layout check alone does not rerun on every navigation). This walks the route tree so a
 * new route without the check fails here instead of shipping.
 */
const root = path.resolve(__dirname, '../../src/routes');
const guarded = [path.join(root, 'workshop'), path.join(root, 'api', 'workshop')];

function walk(dir: string): string[] {
	if (!existsSync(dir)) return [];
	return readdirSync(dir).flatMap((name) => {
		const p = path.join(dir, name);
		return statSync(p).isDirectory() ? walk(p) : [p];
	});
}

const files = guarded.flatMap(walk);
const rel = (p: string) => path.relative(root, p);
const isServerFile = (p: string) => /\+(page|layout)\.server\.ts$|\+server\.ts$/.test(p);
const callsGuard = (src: string) => /\brequireRole(Api)?\s*\(/.test(src);

/** Each exported load, each action and each HTTP method handler, with its body. */
function handlers(src: string): { name: string; body: string }[] {
	const found: { name: string; body: string }[] = [];
	const starts: { name: string; at: number }[] = [];
	for (const m of src.matchAll(/export const (load|GET|POST|PUT|PATCH|DELETE)\b/g)) {
		starts.push({ name: m[1], at: m.index });
	}
	for (const m of src.matchAll(/export (?:async )?function (load|GET|POST|PUT|PATCH|DELETE)\b/g)) {
		starts.push({ name: m[1], at: m.index });
	}
	const actionsAt = src.search(/export const actions\b/);
	if (actionsAt >= 0) {
		// Named actions, one tab in: `name: async (event) => {` or `async name(event) {`.
		for (const m of src
			.slice(actionsAt)
			.matchAll(/^\t(?:(\w+)\s*:\s*(?:async\b|\(\w*\)\s*=>)|async (\w+)\s*\()/gm)) {
			starts.push({ name: `action ${m[1] ?? m[2]}`, at: actionsAt + m.index });
		}
	}
	starts.sort((a, b) => a.at - b.at);
	starts.forEach((s, i) => found.push({ name: s.name, body: src.slice(s.at, starts[i + 1]?.at) }));
	return found;
}

describe('workshop authorisation', () => {
	it('finds the workshop routes to check', () => {
		expect(files.some((f) => f.endsWith(path.join('workshop', '+layout.server.ts')))).toBe(true);
		expect(files.some((f) => f.endsWith(path.join('workshop', '+page.server.ts')))).toBe(true);
	});

	it('walks the order back office routes too (so a moved file cannot slip out of the check)', () => {
		const names = files.map(rel);
		for (const route of [
			path.join('workshop', 'orders', '+page.server.ts'),
			path.join('workshop', 'orders', '[ref]', '+page.server.ts'),
			path.join('workshop', 'queue', '+page.server.ts'),
			path.join('api', 'workshop', 'orders', '+server.ts'),
			path.join('api', 'workshop', 'orders', '[ref]', 'shipments', '+server.ts')
		]) {
			expect(names).toContain(route);
		}
	});

	it('owner-only actions ask for the owner alone', () => {
		// Refunds and the carving week are the owner's; helpers get 403 there.
		const order = readFileSync(
			path.join(root, 'workshop', 'orders', '[ref]', '+page.server.ts'),
			'utf8'
		);
		const queue = readFileSync(path.join(root, 'workshop', 'queue', '+page.server.ts'), 'utf8');
		const body = (src: string, name: string) =>
			handlers(src).find((h) => h.name === `action ${name}`)?.body ?? '';
		// The order page's actions go through its `step`, which calls requireRole with the list.
		const ownerOnly = /requireRole\(e(vent)?, 'owner'\)|step\(e, '\w+', \['owner'\]/;
		expect(body(order, 'refund')).toMatch(ownerOnly);
		expect(body(order, 'returned')).toMatch(ownerOnly);
		expect(order).toMatch(/requireRole\(event, \.\.\.who\)/);
		expect(body(queue, 'hours')).toMatch(/requireRole\(event, 'owner'\)/);
	});

	it('every server file under /workshop and /api/workshop calls requireRole', () => {
		const missing = files
			.filter(isServerFile)
			.filter((f) => !callsGuard(readFileSync(f, 'utf8')))
			.map(rel);
		expect(missing).toEqual([]);
	});

	it('every load, action and endpoint method checks the role itself', () => {
		const missing: string[] = [];
		for (const f of files.filter(isServerFile)) {
			const src = readFileSync(f, 'utf8');
			const list = handlers(src);
			// A file whose own `step` helper calls requireRole may hand each action to it.
			const viaStep = /function step\b[\s\S]*?requireRole\(event, \.\.\.who\)/.test(src);
			for (const h of list) {
				const stepped = viaStep && /^\t\w+: \(e\) =>\s*step\(e, '\w+', /m.test(h.body);
				if (!callsGuard(h.body) && !stepped) missing.push(`${rel(f)}: ${h.name}`);
			}
		}
		expect(missing).toEqual([]);
	});

	it('every workshop page has a server load beside it, so nothing renders unchecked', () => {
		const bare = files
			.filter((f) => f.endsWith('+page.svelte'))
			.filter((f) => !existsSync(path.join(path.dirname(f), '+page.server.ts')))
			.map(rel);
		expect(bare).toEqual([]);
	});

	it('the handler finder sees loads, named actions and methods (self-check)', () => {
		const sample = [
			'export const load: PageServerLoad = async (event) => { requireRole(event, "owner"); };',
			'export const actions: Actions = {',
			'\tship: async (event) => {',
			'\t\treturn 1;',
			'\t},',
			'\trefund: async (event) => { requireRole(event, "owner"); },',
			'\tasync pack(event) { return 2; }',
			'};',
			'export async function GET(event) { return json(1); }'
		].join('\n');
		const list = handlers(sample).map((h) => [h.name, callsGuard(h.body)]);
		expect(list).toEqual([
			['load', true],
			['action ship', false],
			['action refund', true],
			['action pack', false],
			['GET', false]
		]);
	});
});
