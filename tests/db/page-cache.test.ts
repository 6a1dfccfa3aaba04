/**
 * The page cache's answers for visitors without cookies, through the real handle (the catalogue
 * version comes from the test database). Compressed answers are checked by decompressing them
 * with Node's zlib (an independent brotli/gzip implementation) and comparing with the plain one;
 * Accept-Encoding is read as RFC 9110 §12.5.3 says (q=0 refuses a coding); 304 per RFC 9110
 * §13.1.2 (If-None-Match, weak comparison).
 */
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import type { RequestEvent } from '@sveltejs/kit';
import { pageCacheHandle } from '$lib/server/http/page-cache';

const HEAD = `<!doctype html><html><head><title>t</title><link rel="preload" as="image" type="image/webp" imagesrcset="/photos/p/400.webp 400w, /photos/p/800.webp 800w" imagesizes="92vw" fetchpriority="high"/>
<link href="./_app/immutable/assets/0.css" rel="stylesheet"></head><body>`;
const PAGE = `${HEAD}${'<p>A rosette of six petals, each petal two chips.</p>'.repeat(200)}</body></html>`;
const LINK = [
	'<./_app/immutable/assets/0.css>; rel="preload"; as="style"; nopush',
	'<./_app/immutable/entry/start.js>; rel="modulepreload"; nopush',
	'<./_app/immutable/chunks/a.js>; rel="modulepreload"; nopush'
].join(', ');

let n = 0;
/** A unique public path per test, so entries from one test never answer another. */
const freshPath = () => `/shop/page-cache-test-${process.pid}-${Date.now()}-${n++}`;

async function call(path: string, headers: Record<string, string>, csp: string) {
	let rendered = 0;
	const event = {
		request: new Request(`http://localhost${path}`, { headers }),
		url: new URL(`http://localhost${path}`)
	} as unknown as RequestEvent;
	const resolve = (): Promise<Response> => {
		rendered++;
		return Promise.resolve(
			new Response(PAGE, {
				headers: {
					'content-type': 'text/html',
					'content-security-policy': csp,
					etag: '"rendered"',
					link: LINK
				}
			})
		);
	};
	const res: Response = await pageCacheHandle({ event, resolve });
	return { res, rendered };
}

const HASHED = "script-src 'self' 'sha256-abc='";

describe('page cache answers', () => {
	it('stores the page once and answers brotli, gzip or plain as accepted, all the same page', async () => {
		const path = freshPath();
		const first = await call(path, {}, HASHED);
		expect(first.rendered).toBe(1);
		expect(first.res.headers.get('x-page-cache')).toBe('miss');

		const plain = await call(path, {}, HASHED);
		expect(plain.rendered).toBe(0);
		expect(plain.res.headers.get('x-page-cache')).toBe('hit');
		expect(plain.res.headers.get('content-encoding')).toBeNull();
		const html = await plain.res.text();

		const br = await call(path, { 'accept-encoding': 'gzip, deflate, br' }, HASHED);
		expect(br.res.headers.get('content-encoding')).toBe('br');
		const brBytes = Buffer.from(await br.res.arrayBuffer());
		expect(Number(br.res.headers.get('content-length'))).toBe(brBytes.length);
		expect(brotliDecompressSync(brBytes).toString()).toBe(html);
		expect(brBytes.length).toBeLessThan(html.length / 4);

		const gz = await call(path, { 'accept-encoding': 'br;q=0, gzip' }, HASHED);
		expect(gz.res.headers.get('content-encoding')).toBe('gzip');
		expect(gunzipSync(Buffer.from(await gz.res.arrayBuffer())).toString()).toBe(html);
		expect(gz.res.headers.get('vary')).toContain('Accept-Encoding');
	});

	it('asks for the lead photo before the scripts: script preloads move from the Link header into the head', async () => {
		const path = freshPath();
		await call(path, {}, HASHED);
		const hit = await call(path, {}, HASHED);
		const html = await hit.res.text();
		const image = html.indexOf('as="image"');
		const script = html.indexOf(
			'<link rel="modulepreload" href="./_app/immutable/entry/start.js">'
		);
		expect(image).toBeGreaterThan(0);
		expect(script).toBeGreaterThan(image);
		expect(script).toBeLessThan(html.indexOf('</head>'));
		expect(html).toContain('<link rel="modulepreload" href="./_app/immutable/chunks/a.js">');
		// The stylesheet stays in the header; no script is announced twice.
		expect(hit.res.headers.get('link')).toBe(
			'<./_app/immutable/assets/0.css>; rel="preload"; as="style"; nopush'
		);
		// The ETag names the bytes answered, not the page as first rendered.
		const etag = hit.res.headers.get('etag')!;
		expect(etag).not.toBe('"rendered"');
		const again = await call(path, { 'if-none-match': `W/${etag}` }, HASHED);
		expect(again.res.status).toBe(304);
		expect(again.rendered).toBe(0);
	});

	it('never stores a page whose policy carries a nonce (a nonce must not repeat)', async () => {
		const path = freshPath();
		const nonce = "script-src 'self' 'nonce-abc123'";
		await call(path, {}, nonce);
		const second = await call(path, {}, nonce);
		expect(second.rendered).toBe(1);
		expect(second.res.headers.get('x-page-cache')).toBeNull();
	});

	it('serves a stored public page to a visitor with a session cookie and a basket', async () => {
		const path = freshPath();
		await call(path, {}, HASHED);
		const stranger = await call(path, {}, HASHED);
		const plain = await stranger.res.text();
		const withCookie = await call(path, { cookie: 'auth_session=abc; cart=x' }, HASHED);
		expect(withCookie.rendered).toBe(0);
		expect(withCookie.res.headers.get('x-page-cache')).toBe('hit');
		expect(withCookie.res.headers.has('set-cookie')).toBe(false);
		expect(await withCookie.res.text()).toBe(plain);
	});

	it('never stores a page rendered for a request with cookies', async () => {
		const path = freshPath();
		const withCookie = await call(path, { cookie: 'auth_session=abc' }, HASHED);
		expect(withCookie.rendered).toBe(1);
		const stranger = await call(path, {}, HASHED);
		expect(stranger.rendered).toBe(1);
		expect(stranger.res.headers.get('x-page-cache')).toBe('miss');
	});

	it('never stores an answer that sets a cookie', async () => {
		const path = freshPath();
		let rendered = 0;
		const event = {
			request: new Request(`http://localhost${path}`),
			url: new URL(`http://localhost${path}`)
		} as unknown as RequestEvent;
		const resolve = (): Promise<Response> => {
			rendered++;
			return Promise.resolve(
				new Response(PAGE, {
					headers: {
						'content-type': 'text/html',
						'content-security-policy': HASHED,
						'set-cookie': 'cart=y; Path=/; HttpOnly'
					}
				})
			);
		};
		await pageCacheHandle({ event, resolve });
		const again: Response = await pageCacheHandle({ event, resolve });
		expect(rendered).toBe(2);
		expect(again.headers.get('x-page-cache')).toBeNull();
	});
});

describe('page cache keys by what the client asked', () => {
	/** The event SvelteKit builds for a data request: `event.url` without its suffix and flags. */
	async function ask(sent: string, seen: string, body: string, type: string) {
		let rendered = 0;
		const event = {
			request: new Request(`http://localhost${sent}`),
			url: new URL(`http://localhost${seen}`)
		} as unknown as RequestEvent;
		const resolve = (): Promise<Response> => {
			rendered++;
			return Promise.resolve(
				new Response(body, { headers: { 'content-type': type, 'content-security-policy': HASHED } })
			);
		};
		const res: Response = await pageCacheHandle({ event, resolve });
		return { res, rendered, text: await res.text() };
	}

	it('never answers a data request with a stored page, nor a page with stored data', async () => {
		const path = freshPath();
		const json = '{"type":"data","nodes":[]}';
		const data = `${path}/__data.json?x-sveltekit-invalidated=011`;
		expect((await ask(data, path, json, 'application/json')).rendered).toBe(1);
		const page = await ask(path, path, PAGE, 'text/html');
		expect(page.rendered).toBe(1);
		expect(page.text).toBe(PAGE);
		const dataAgain = await ask(data, path, PAGE, 'text/html');
		expect(dataAgain.rendered).toBe(0);
		expect(dataAgain.text).toBe(json);
		const pageAgain = await ask(path, path, json, 'application/json');
		expect(pageAgain.rendered).toBe(0);
		expect(pageAgain.text).toBe(PAGE);
	});

	it('does not keep an answer whose type does not fit the request', async () => {
		const path = freshPath();
		await ask(path, path, '{"a":1}', 'application/json');
		expect((await ask(path, path, PAGE, 'text/html')).rendered).toBe(1);
		const data = `${path}/__data.json`;
		await ask(data, path, PAGE, 'text/html');
		expect((await ask(data, path, '{}', 'application/json')).rendered).toBe(1);
	});

	it('shares one entry between addresses that differ only in unread parameters', async () => {
		const path = freshPath();
		await ask(`${path}?utm_source=x`, path, PAGE, 'text/html');
		const other = await ask(`${path}?junk=${Date.now()}`, path, 'other', 'text/html');
		expect(other.rendered).toBe(0);
		expect(other.text).toBe(PAGE);
	});
});
