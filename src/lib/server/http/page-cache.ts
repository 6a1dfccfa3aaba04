import { createHash } from 'node:crypto';
import { promisify } from 'node:util';
import { brotliCompress, constants, gzip } from 'node:zlib';
import type { Handle } from '@sveltejs/kit';
import { LRUCache } from 'lru-cache';
import { catalogueVersion, catalogueVersionIfFresh } from '$lib/server/catalogue/cache';
import { config } from '$lib/server/config';
import { today } from '$lib/locale/dates';
import { woodFilterOptions } from '$lib/server/catalogue/catalogue';
import { fitsRequest, pageCacheKey } from './page-cache-key';
import { scriptPreloadsIntoHead } from './link-preloads';
import { otherHostOf } from './address';
import { applySecurityHeaders } from './security-headers';

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
 *
 * Requests for a page being rendered wait for that one render rather than starting their own: 50
 * visitors arriving together at an expired piece page made 50 renders and 50 compressions. The
 * compression runs off the event loop (zlib's thread pool).
 *
 * Hits are also answered before SvelteKit sees the request, by `earlyAnswer` (called from the
 * built server, page-cache-front.ts), with the same bytes and headers, the security headers
 * included; it answers only while this handle has confirmed the catalogue version and the day
 * within the last CHECK_MS, and leaves everything else (a redirect to ORIGIN, a body, an
 * Authorization header) to SvelteKit.
 */
/** Bytes kept per process (every stored encoding counted); least recently used go first. */
const MAX_BYTES = 48 * 1024 * 1024;

type Bytes = Uint8Array<ArrayBuffer>;
/** `early`: the same headers as sent to the visitor, security headers included, for node:http. */
type Encoded = { body: Bytes; headers: Headers; early: Record<string, string> };
type Stored = {
	status: number;
	etag: string | null;
	/** The path as the client sent it when stored; the front answers only that exact path. */
	path: string;
	identity: Encoded;
	gzip: Encoded;
	br: Encoded;
	notModified: Headers;
	notModifiedEarly: Record<string, string>;
};

/** How long a confirmed version (and day) lets the front answer without asking SvelteKit. */
const CONFIRMED_MS = 1000;
const brotliAsync = promisify(brotliCompress);
const gzipAsync = promisify(gzip);

/**
 * How long a piece page is kept: its "ready by" date comes from the carving queue, and order
 * moves are kept out of the catalogue version so they do not drop every page.
 */
const QUEUE_DATE_MS = 60_000;

let version = '';
/** When this handle last confirmed `version`, and the woods read under it, for the front. */
let confirmedAt = 0;
let confirmedWoods: ReadonlySet<string> | null = null;
/** Renders under way for storing, by key: requests for the same page wait for them. */
const inFlight = new Map<string, Promise<Stored | null>>();
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

/** The headers as the visitor receives them (after the outer handle), as node:http takes them. */
function sent(headers: Headers, https: boolean): Record<string, string> {
	const out = new Headers(headers);
	applySecurityHeaders(out, https);
	return Object.fromEntries(out);
}

function encoded(base: Headers, body: Bytes, encoding: string | null, https: boolean): Encoded {
	const headers = new Headers(base);
	headers.set('content-length', String(body.byteLength));
	if (encoding) headers.set('content-encoding', encoding);
	return { body, headers, early: sent(headers, https) };
}

/** Builds everything a hit needs once, so answering is a look-up. */
async function store(
	response: Response,
	rendered: Bytes,
	data: boolean,
	path: string,
	https: boolean
): Promise<Stored> {
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
	const [br, gz] = await Promise.all([
		brotliAsync(bytes, {
			params: {
				[constants.BROTLI_PARAM_QUALITY]: 9,
				[constants.BROTLI_PARAM_SIZE_HINT]: bytes.byteLength
			}
		}),
		gzipAsync(bytes, { level: 9 })
	]);
	const notModified = new Headers(base);
	notModified.delete('content-length');
	return {
		status: response.status,
		etag,
		path,
		identity: encoded(base, bytes, null, https),
		gzip: encoded(base, new Uint8Array(gz), 'gzip', https),
		br: encoded(base, new Uint8Array(br), 'br', https),
		notModified,
		notModifiedEarly: sent(notModified, https)
	};
}

/** The encoding the client accepts that we hold, brotli first (RFC 9110 §12.5.3, q=0 refuses). */
function pick(stored: Stored, accept: string | null | undefined): Encoded {
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

/** If-None-Match names the stored page (weak comparison, RFC 9110 §13.1.2). */
function unchanged(stored: Stored, inm: string | null | undefined): boolean {
	return (
		!!inm &&
		stored.etag !== null &&
		inm.split(',').some((t) => t.trim().replace(/^W\//, '') === stored.etag)
	);
}

function answer(stored: Stored, request: Request): Response {
	if (unchanged(stored, request.headers.get('if-none-match'))) {
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
	let woods: ReadonlySet<string>;
	let target: ReturnType<typeof pageCacheKey>;
	try {
		v = `${await catalogueVersion()}|${today()}`;
		woods = await knownWoods();
		target = pageCacheKey(asked, woods);
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
	confirmedAt = Date.now();
	confirmedWoods = woods;
	const hit = pages.get(target.key);
	if (hit) return answer(hit, request);
	const rendering = inFlight.get(target.key);
	if (rendering) {
		const stored = await rendering;
		return stored ? answer(stored, request) : resolve(event);
	}
	if (!storable || method !== 'GET') return resolve(event);

	const key = target.key;
	let settle: (s: Stored | null) => void = () => {};
	const flight = new Promise<Stored | null>((r) => (settle = r));
	inFlight.set(key, flight);
	const done = (s: Stored | null) => {
		settle(s);
		if (inFlight.get(key) === flight) inFlight.delete(key);
	};
	let response: Response;
	try {
		response = await resolve(event);
	} catch (err) {
		done(null);
		throw err;
	}
	if (
		response.status !== 200 ||
		!fitsRequest(response.headers.get('content-type'), target.data) ||
		response.headers.has('set-cookie') ||
		response.headers.has('content-encoding') ||
		/'nonce-/.test(response.headers.get('content-security-policy') ?? '')
	) {
		done(null);
		return response;
	}
	let bytes: Bytes;
	try {
		bytes = new Uint8Array(await response.arrayBuffer());
	} catch (err) {
		done(null);
		throw err;
	}
	// Only keep what was rendered under the version we looked up; a page begun before an edit
	// and finished after it would otherwise outlive the edit.
	if (v === version) {
		const https = event.url.protocol === 'https:';
		store(response, bytes, target.data, asked.pathname, https).then(
			(stored) => {
				if (v === version)
					pages.set(key, stored, target.piece ? { ttl: QUEUE_DATE_MS } : undefined);
				done(v === version ? stored : null);
			},
			(err: unknown) => {
				console.error(err);
				done(null);
			}
		);
	} else done(null);
	const out = new Headers(response.headers);
	out.set('x-page-cache', 'miss');
	return new Response(bytes, { status: response.status, headers: out });
};

/** What the front writes: status, headers as node:http takes them, and the body (null: none). */
export type EarlyAnswer = { status: number; headers: Record<string, string>; body: Bytes | null };

let origin: URL | null = null;

/**
 * A stored page for a request as node:http received it, before SvelteKit: null whenever the
 * handle chain must see the request (not a plain GET or HEAD of a stored public page at the
 * exact path it was stored under, a body, Authorization, another host name to redirect from,
 * or the catalogue version or day not confirmed within CONFIRMED_MS).
 */
export function earlyAnswer(
	method: string | undefined,
	rawUrl: string | undefined,
	header: (name: string) => string | undefined,
	now = Date.now()
): EarlyAnswer | null {
	if ((method !== 'GET' && method !== 'HEAD') || !rawUrl || rawUrl[0] !== '/') return null;
	if (now - confirmedAt >= CONFIRMED_MS || !confirmedWoods) return null;
	const fresh = catalogueVersionIfFresh(now);
	if (fresh === null || !version.startsWith(`${fresh}|`)) return null;
	if (header('authorization') !== undefined || header('transfer-encoding') !== undefined)
		return null;
	const length = header('content-length');
	if (length !== undefined && length !== '0') return null;
	origin ??= new URL(config.origin);
	if (config.redirectOtherHosts && otherHostOf(header('host'), header('x-forwarded-host'), origin))
		return null;
	let url: URL;
	try {
		url = new URL(rawUrl, origin);
	} catch {
		return null;
	}
	const target = pageCacheKey(url, confirmedWoods);
	if (!target) return null;
	const stored = pages.get(target.key);
	if (!stored || stored.path !== url.pathname) return null;
	if (unchanged(stored, header('if-none-match')))
		return { status: 304, headers: stored.notModifiedEarly, body: null };
	const chosen = pick(stored, header('accept-encoding'));
	return {
		status: stored.status,
		headers: chosen.early,
		body: method === 'HEAD' ? null : chosen.body
	};
}
