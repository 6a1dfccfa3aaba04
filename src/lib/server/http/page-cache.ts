import { createHash } from 'node:crypto';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';
import type { Handle } from '@sveltejs/kit';
import { LRUCache } from 'lru-cache';
import { catalogueVersion } from '$lib/server/catalogue/cache';
import { today } from '$lib/locale/dates';
import { woodFilterOptions } from '$lib/server/catalogue/catalogue';
import { fitsRequest, pageCacheKey } from './page-cache-key';
import { scriptPreloadsIntoHead } from './link-preloads';

/**
 * Whole rendered public pages, the same for every visitor, kept per process.
 *
 * Every visitor gets the same bytes until the owner changes the catalogue or the shop's settings,
 * yet each request would run the loads, the queries and the server render. The key is what the client asked (page-cache-key.ts: the
 * path as sent, `/__data.json` included, and the query parameters the page reads), and an answer
 * is kept only when its type fits the request (HTML for a page, JSON for data). Entries live
 * until the catalogue version changes (a counter row that triggers bump in the same transaction
 * as any catalogue or settings write, asked at most once a second) or the shop's day turns, in
 * its zone (the away notice and "ready to ship by" move with the date). An edit made through any
 * app process, a script or by hand bumps the counter, so every process drops its pages within a
 * second. Visitors with cookies (signed in, or with a basket) are answered from the same entries:
 * what depends on the visitor (basket count, name) is asked by the browser from /api/me after the
 * page loads. A page is stored only from a request without cookies whose answer sets none.
 *
 * A hit does as little as it can, since it is most of the shop's traffic: the page's
 * Content-Security-Policy names its inline script by hash (`kit.csp.mode: 'hash'`), so the stored
 * bytes are answered unchanged, and they are compressed once when stored (brotli and gzip) rather
 * than on every answer. A page whose policy carries a nonce is never stored: a nonce must not
 * repeat between answers.
 *
 * Sits before the ETag handle: a miss goes through it, so the stored headers carry the ETag, and a
 * hit answers If-None-Match itself.
 */
/** Bytes kept per process (every stored encoding counted); least recently used go first. */
const MAX_BYTES = 48 * 1024 * 1024;

type Bytes = Uint8Array<ArrayBuffer>;
type Encoded = { body: Bytes; headers: Headers };
type Stored = {
	status: number;
	etag: string | null;
	identity: Encoded;
	gzip: Encoded;
	br: Encoded;
	notModified: Headers;
};

/**
 * How long a piece page is kept: its "ready by" date comes from the carving queue, and order
 * moves are kept out of the catalogue version so they do not drop every page.
 */
const QUEUE_DATE_MS = 60_000;

let version = '';
const pages = new LRUCache<string, Stored>({
	maxSize: MAX_BYTES,
	sizeCalculation: (s) =>
		s.identity.body.byteLength + s.gzip.body.byteLength + s.br.body.byteLength + 1024
});

const NO_WOODS: ReadonlySet<string> = new Set();

/** The woods the shop can be filtered by, as a set, once per catalogue version. */
const woodSets = new WeakMap<object, ReadonlySet<string>>();
async function knownWoods(): Promise<ReadonlySet<string>> {
	const options = await woodFilterOptions();
	let set = woodSets.get(options);
	if (!set) woodSets.set(options, (set = new Set(options.map((w) => w.slug))));
	return set;
}

function encoded(base: Headers, body: Bytes, encoding: string | null): Encoded {
	const headers = new Headers(base);
	headers.set('content-length', String(body.byteLength));
	if (encoding) headers.set('content-encoding', encoding);
	return { body, headers };
}

/** Builds everything a hit needs once, so answering is a look-up. */
function store(response: Response, rendered: Bytes, data: boolean): Stored {
	const base = new Headers(response.headers);
	base.set('x-page-cache', 'hit');
	base.append('vary', 'Accept-Encoding');
	let bytes = rendered;
	if (!data) {
		const html = new TextDecoder().decode(rendered);
		const moved = scriptPreloadsIntoHead(base, html);
		if (moved !== html) bytes = new TextEncoder().encode(moved);
	}
	// The tag the ETag handle gave the rendered page, for the bytes actually answered.
	let etag = response.headers.get('etag');
	if (etag && bytes !== rendered) {
		etag = `"${createHash('sha1').update(bytes).digest('base64url')}"`;
		base.set('etag', etag);
	}
	const br = brotliCompressSync(bytes, {
		params: {
			[constants.BROTLI_PARAM_QUALITY]: 9,
			[constants.BROTLI_PARAM_SIZE_HINT]: bytes.byteLength
		}
	});
	const gz = gzipSync(bytes, { level: 9 });
	const notModified = new Headers(base);
	notModified.delete('content-length');
	return {
		status: response.status,
		etag,
		identity: encoded(base, bytes, null),
		gzip: encoded(base, new Uint8Array(gz), 'gzip'),
		br: encoded(base, new Uint8Array(br), 'br'),
		notModified
	};
}

/** The encoding the client accepts that we hold, brotli first (RFC 9110 §12.5.3, q=0 refuses). */
function pick(stored: Stored, accept: string | null): Encoded {
	if (!accept) return stored.identity;
	const ok = (name: string) =>
		accept.split(',').some((part) => {
			const [token, ...params] = part.trim().split(';');
			if (token.trim().toLowerCase() !== name) return false;
			return !params.some((p) => /^\s*q\s*=\s*0(\.0*)?\s*$/.test(p));
		});
	if (ok('br')) return stored.br;
	if (ok('gzip')) return stored.gzip;
	return stored.identity;
}

function answer(stored: Stored, request: Request): Response {
	const inm = request.headers.get('if-none-match');
	if (
		inm &&
		stored.etag !== null &&
		inm.split(',').some((t) => t.trim().replace(/^W\//, '') === stored.etag)
	) {
		return new Response(null, { status: 304, headers: stored.notModified });
	}
	const chosen = pick(stored, request.headers.get('accept-encoding'));
	return new Response(request.method === 'HEAD' ? null : chosen.body, {
		status: stored.status,
		headers: chosen.headers
	});
}

export const pageCacheHandle: Handle = async ({ event, resolve }) => {
	const { request } = event;
	const method = request.method;
	if ((method !== 'GET' && method !== 'HEAD') || request.headers.has('authorization')) {
		return resolve(event);
	}
	// A visitor with cookies (a basket, signed in) is served stored pages like anyone else, since
	// the public pages carry nothing personal; but a page is only ever stored from a request
	// without cookies, so nothing a load might read from a cookie can enter the cache.
	const storable = !request.headers.has('cookie');
	// The address as the client sent it: SvelteKit has taken `/__data.json` and its own
	// parameters out of `event.url`.
	const asked = new URL(request.url);
	if (pageCacheKey(asked, NO_WOODS) === null) return resolve(event);
	let v: string;
	let target: ReturnType<typeof pageCacheKey>;
	try {
		v = `${await catalogueVersion()}|${today()}`;
		target = pageCacheKey(asked, await knownWoods());
	} catch {
		// No version, no cache: the page renders as if uncached, so its loads meet the same error
		// inside SvelteKit (a 503 while the database is down) and every outer handle still runs.
		return resolve(event);
	}
	if (!target) return resolve(event);
	if (v !== version) {
		pages.clear();
		version = v;
	}
	const hit = pages.get(target.key);
	if (hit) return answer(hit, request);

	const response = await resolve(event);
	if (
		!storable ||
		method !== 'GET' ||
		response.status !== 200 ||
		!fitsRequest(response.headers.get('content-type'), target.data) ||
		response.headers.has('set-cookie') ||
		response.headers.has('content-encoding') ||
		/'nonce-/.test(response.headers.get('content-security-policy') ?? '')
	) {
		return response;
	}
	const bytes = new Uint8Array(await response.arrayBuffer());
	// Only keep what was rendered under the version we looked up; a page begun before an edit
	// and finished after it would otherwise outlive the edit.
	if (v === version) {
		const stored = store(response, bytes, target.data);
		pages.set(target.key, stored, target.piece ? { ttl: QUEUE_DATE_MS } : undefined);
	}
	const out = new Headers(response.headers);
	out.set('x-page-cache', 'miss');
	return new Response(bytes, { status: response.status, headers: out });
};
