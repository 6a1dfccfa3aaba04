/**
 * The access matrix: every page, form action and endpoint found in src/routes × anonymous,
 * customer, helper and owner, each answer compared with its row in access/expectations.ts.
 * The expected outcomes are the shop's rules (workshop for staff, settings and people for the
 * owner, orders for the account that placed them) written down, not answers recorded from a run.
 */
import { expect, request, test, type APIRequestContext, type APIResponse } from '@playwright/test';
import mysql from 'mysql2/promise';
import { routeEntries, type Entry } from '../helpers/route-tree';
import { demoAccount } from '../helpers/auth';
import {
	EXPECTATIONS,
	ROLE_NAMES,
	type Fixtures,
	type Outcome,
	type RoleName
} from './access/expectations';

const origin = process.env.ORIGIN ?? `http://localhost:${process.env.PORT ?? 3100}`;
const entries = routeEntries();

async function fixtures(): Promise<Fixtures> {
	const conn = await mysql.createConnection(process.env.DATABASE_URL!);
	try {
		const [[line]] = (await conn.query(
			`select l.id from order_lines l join orders o on o.id = l.order_id where o.ref = 'CS-1001' limit 1`
		)) as unknown as [{ id: number }[]];
		const [[photo]] = (await conn.query(
			'select storage_key as k from photos order by id limit 1'
		)) as unknown as [{ k: string }[]];
		const [[fair]] = (await conn.query(
			'select id from fairs where closed_at is not null order by id limit 1'
		)) as unknown as [{ id: number }[]];
		const [[piece]] = (await conn.query(
			'select id from pieces order by id limit 1'
		)) as unknown as [{ id: number }[]];
		return { lineId: line.id, photoKey: photo.k, closedFairId: fair.id, pieceId: piece.id };
	} finally {
		await conn.end();
	}
}

/** As a browser's form post or page load (SvelteKit answers form posts with JSON otherwise). */
const asBrowser = { maxRedirects: 0, failOnStatusCode: false, headers: { accept: 'text/html' } };

/** A request context signed in through the real sign-in form (anonymous: no sign-in). */
export async function contextFor(role: RoleName): Promise<APIRequestContext> {
	const ctx = await request.newContext({ baseURL: origin, extraHTTPHeaders: { origin } });
	if (role === 'anonymous') return ctx;
	const { email, password } = demoAccount(role);
	const res = await ctx.post('/signin', { ...asBrowser, form: { email, password } });
	expect(res.status(), `sign-in as ${role}`).toBe(303);
	return ctx;
}

function outcomeOf(res: APIResponse): string {
	const s = res.status();
	if (s >= 300 && s < 400) {
		const to = new URL(res.headers()['location'] ?? '/', origin).pathname;
		return to === '/signin' ? 'signin' : 'redirect';
	}
	if (s === 200) return 'ok';
	if (s === 401) return 'unauthorised';
	if (s === 403) return 'forbidden';
	if (s === 404) return 'notfound';
	return s < 500 ? `status ${s}` : `error ${s}`;
}

function matches(expected: Outcome, actual: string): boolean {
	if (expected === 'allowed') {
		return !['signin', 'unauthorised', 'forbidden'].includes(actual) && !actual.startsWith('error');
	}
	return expected === actual;
}

function call(ctx: APIRequestContext, e: Entry, url: string) {
	if (e.kind === 'action') return ctx.post(url, { ...asBrowser, form: { _matrix: '1' } });
	if (e.kind === 'page') return ctx.get(url, asBrowser);
	const opts = { maxRedirects: 0, failOnStatusCode: false };
	if (e.method === 'GET') return ctx.get(url, opts);
	return ctx.fetch(url, { ...opts, method: e.method, data: {} });
}

test.describe('access matrix', () => {
	test('every route in src/routes has an expectation, and every expectation a route', () => {
		const keys = entries.map((e) => e.key);
		const missing = keys.filter((k) => !(k in EXPECTATIONS));
		const stale = Object.keys(EXPECTATIONS).filter((k) => !keys.includes(k));
		expect(missing, 'routes without an entry in tests/e2e/access/expectations.ts').toEqual([]);
		expect(stale, 'expectations for routes that no longer exist').toEqual([]);
	});

	for (const role of ROLE_NAMES) {
		test(`${role}: every route answers as expected`, async () => {
			test.setTimeout(60_000);
			const f = await fixtures();
			const ctx = await contextFor(role);
			// Signing out ends the session the rest of the walk needs: do it last.
			const ordered = [...entries].sort(
				(a, b) => Number(a.key === 'POST /signout') - Number(b.key === 'POST /signout')
			);
			const wrong: string[] = [];
			for (const e of ordered) {
				const x = EXPECTATIONS[e.key];
				if (!x) continue; // reported by the test above
				const own = e.action ? `${e.route}?/${e.action}` : e.route;
				const url = typeof x.url === 'function' ? x.url(f) : (x.url ?? own);
				const actual = outcomeOf(await call(ctx, e, url));
				if (!matches(x[role], actual))
					wrong.push(`${e.key} (${url}): expected ${x[role]}, got ${actual}`);
			}
			await ctx.dispose();
			expect(wrong).toEqual([]);
		});
	}

	test("a customer sees their own order and nobody else's", async () => {
		const ctx = await contextFor('customer');
		// CS-1001 and CS-1006 were placed by the demo customer; CS-1002 by another buyer.
		expect((await ctx.get('/orders/CS-1006', { maxRedirects: 0 })).status()).toBe(200);
		expect((await ctx.get('/orders/CS-1002', { maxRedirects: 0 })).status()).toBe(404);
		const account = await (await ctx.get('/account')).text();
		expect(account).toContain('CS-1001');
		expect(account).not.toContain('CS-1002');
		await ctx.dispose();
	});
});
