/**
 * The page cache in front of SvelteKit (page-cache-front.ts) answers exactly what the handle's
 * hit answers once the outer handle has added the security headers: same status, headers and
 * bytes, 304 for a matching If-None-Match (RFC 9110 §13.1.2), no body for HEAD (RFC 9110 §9.3.2),
 * and leaves to SvelteKit whatever the chain must see. Also: visitors arriving together at a page
 * being rendered share that one render. The catalogue version comes from the test database.
 */
import { createServer, request, type IncomingHttpHeaders, type Server } from 'node:http';
import { readFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { describe, expect, it } from 'vitest';
import type { RequestEvent } from '@sveltejs/kit';
import { earlyAnswer, pageCacheHandle } from '$lib/server/http/page-cache';
import { answerFromFront } from '$lib/server/http/page-cache-front';
import { withSecurityHeaders } from '$lib/server/http/security-headers';
import { config } from '$lib/server/config';
import { withPageCacheFront } from '../../scripts/adapter/cluster.js';

const HASHED = "script-src 'self' 'sha256-abc='";
const PAGE = `<!doctype html><html><head><title>t</title></head><body>${'<p>Six petals, two chips each.</p>'.repeat(100)}</body></html>`;
const HOST = new URL(config.origin).host;
let n = 0;
const freshPath = () => `/shop/page-cache-front-${process.pid}-${Date.now()}-${n++}`;
/** A GET with the origin's Host header (fetch would send the socket's address as the host). */
function get(port: number, path: string) {
	return new Promise<{ status: number; headers: IncomingHttpHeaders; body: string }>((ok, fail) => {
		request({ port, host: '127.0.0.1', path, headers: { host: HOST } }, (res) => {
			let body = '';
			res.setEncoding('utf8');
			res.on('data', (c: string) => (body += c));
			res.on('end', () => ok({ status: res.statusCode ?? 0, headers: res.headers, body }));
		})
			.on('error', fail)
			.end();
	});
}
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Stores a page: the miss, then a request that waits for the (off-thread) compression. */
async function stored(path: string) {
	await viaHandle(path);
	return viaHandle(path);
}

/** The handle as SvelteKit runs it, then the outer handle's security headers (hooks.server.ts). */
async function viaHandle(path: string, headers: Record<string, string> = {}, renderMs = 0) {
	let rendered = 0;
	const url = `${config.origin}${path}`;
	const event = {
		request: new Request(url, { headers: { host: HOST, ...headers } }),
		url: new URL(url)
	} as unknown as RequestEvent;
	const resolve = async (): Promise<Response> => {
		rendered++;
		if (renderMs) await sleep(renderMs);
		return new Response(PAGE, {
			headers: { 'content-type': 'text/html', 'content-security-policy': HASHED, etag: '"r1"' }
		});
	};
	const res = withSecurityHeaders(await pageCacheHandle({ event, resolve }), false);
	return { res, rendered, body: new Uint8Array(await res.arrayBuffer()) };
}

const headerFn =
	(h: Record<string, string>) =>
	(name: string): string | undefined =>
		({ host: HOST, ...h })[name];

describe('page cache front', () => {
	it('answers a stored page with the same status, headers and bytes as the handle', async () => {
		const path = freshPath();
		await stored(path);
		const asked: Record<string, string>[] = [
			{},
			{ 'accept-encoding': 'gzip, deflate, br' },
			{ 'accept-encoding': 'gzip' }
		];
		for (const h of asked) {
			const slow = await viaHandle(path, h);
			expect(slow.res.headers.get('x-page-cache')).toBe('hit');
			const fast = earlyAnswer('GET', path, headerFn(h));
			expect(fast).not.toBeNull();
			expect(fast!.status).toBe(slow.res.status);
			expect(fast!.headers).toEqual(Object.fromEntries(slow.res.headers));
			expect(fast!.headers['x-frame-options']).toBe('DENY');
			expect(fast!.headers['content-security-policy']).toBe(HASHED);
			expect(Buffer.from(fast!.body!).equals(Buffer.from(slow.body))).toBe(true);
		}
	});

	it('answers 304 to a matching If-None-Match and no body to HEAD, as the handle does', async () => {
		const path = freshPath();
		await stored(path);
		const etag = (await viaHandle(path)).res.headers.get('etag')!;
		const slow = await viaHandle(path, { 'if-none-match': `W/${etag}` });
		const fast = earlyAnswer('GET', path, headerFn({ 'if-none-match': `W/${etag}` }));
		expect(slow.res.status).toBe(304);
		expect(fast?.status).toBe(304);
		expect(fast?.body).toBeNull();
		expect(fast?.headers).toEqual(Object.fromEntries(slow.res.headers));
		const head = earlyAnswer('HEAD', path, headerFn({}));
		expect(head?.status).toBe(200);
		expect(head?.body).toBeNull();
		expect(Number(head?.headers['content-length'])).toBe(PAGE.length);
	});

	it('serves a visitor with a basket cookie the stored page and sets no cookie', async () => {
		const path = freshPath();
		await stored(path);
		const fast = earlyAnswer('GET', path, headerFn({ cookie: 'cart=abc; auth_session=x' }));
		expect(fast?.status).toBe(200);
		expect(fast?.headers['set-cookie']).toBeUndefined();
	});

	it('leaves to SvelteKit what the handle chain must see', async () => {
		const path = freshPath();
		await stored(path);
		expect(earlyAnswer('GET', path, headerFn({}))).not.toBeNull();
		expect(earlyAnswer('POST', path, headerFn({}))).toBeNull();
		expect(earlyAnswer('GET', path, headerFn({ authorization: 'Basic eDp5' }))).toBeNull();
		expect(earlyAnswer('GET', path, headerFn({ 'content-length': '5' }))).toBeNull();
		expect(earlyAnswer('GET', path, headerFn({ 'transfer-encoding': 'chunked' }))).toBeNull();
		// The redirect to ORIGIN for another host name is the address handle's (address.ts).
		if (config.redirectOtherHosts)
			expect(earlyAnswer('GET', path, headerFn({ host: 'elsewhere.test' }))).toBeNull();
		// Another spelling of the path: the router decides (a redirect, or the same page).
		expect(earlyAnswer('GET', `${path}/`, headerFn({}))).toBeNull();
		expect(earlyAnswer('GET', path.replace('front', 'fr%6Fnt'), headerFn({}))).toBeNull();
		// Unread parameters share the entry, as in the handle (page-cache-key.ts).
		expect(earlyAnswer('GET', `${path}?utm_source=x`, headerFn({}))?.status).toBe(200);
		// Not confirmed by the handle within a second: SvelteKit asks the database again.
		expect(earlyAnswer('GET', path, headerFn({}), Date.now() + 1500)).toBeNull();
		expect(earlyAnswer('GET', freshPath(), headerFn({}))).toBeNull();
	});

	it('writes the stored page through node:http', async () => {
		const path = freshPath();
		await stored(path);
		const slow = await viaHandle(path);
		const server: Server = createServer((req, res) => {
			if (!answerFromFront(req, res)) {
				res.writeHead(418);
				res.end();
			}
		});
		await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
		try {
			const port = (server.address() as AddressInfo).port;
			const got = await get(port, path);
			expect(got.status).toBe(200);
			expect(got.body).toBe(new TextDecoder().decode(slow.body));
			expect(got.headers['content-security-policy']).toBe(HASHED);
			expect((await get(port, '/api/me')).status).toBe(418);
		} finally {
			server.close();
		}
	});
});

describe('page cache misses', () => {
	it('renders a page once for visitors arriving together, and answers them all from it', async () => {
		const path = freshPath();
		const all = await Promise.all(Array.from({ length: 8 }, () => viaHandle(path, {}, 50)));
		expect(all.reduce((s, r) => s + r.rendered, 0)).toBe(1);
		expect(all.filter((r) => r.res.headers.get('x-page-cache') === 'hit')).toHaveLength(7);
		for (const r of all) expect(new TextDecoder().decode(r.body)).toBe(PAGE);
	});
});

describe('the built server', () => {
	const adapterServer = readFileSync('node_modules/@sveltejs/adapter-node/files/index.js', 'utf8');
	it("puts the page cache front before adapter-node's handler, and fails loudly if it cannot", () => {
		const out = withPageCacheFront(adapterServer);
		expect(out).toContain('.use(pageCacheFront, handler)');
		expect(out.indexOf('const pageCacheFront')).toBeLessThan(out.indexOf('polka({'));
		expect(() => withPageCacheFront('const server = http.createServer(handler);')).toThrow();
	});
});
