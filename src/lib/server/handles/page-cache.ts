import { randomBytes } from 'node:crypto';
import type { Handle } from '@sveltejs/kit';
import { catalogueVersion } from '$lib/server/catalogue-cache';
import { isPublicPage } from './public-pages';

/**
 * Whole rendered public pages for visitors without cookies, kept per process.
 *
 * Such a visitor gets the same bytes as every other one until the owner changes the catalogue or
 * the shop's settings, yet each request ran the loads, the queries and the server render (the
 * piece page draws its rosettes twice). The key is the URL plus the catalogue version — the
 * MariaDB checksum of the catalogue and settings tables, asked at most once a second — plus the
 * day (the away notice and "ready to ship by" move with the date). An edit made through any app
 * process, a script or by hand changes the checksum, so every process drops its pages within a
 * second. Anyone with a cookie (signed in, or with a basket) is rendered afresh, as before.
 *
 * Sits before the ETag handle: a miss goes through it, so the stored headers carry the ETag, and a
 * hit answers If-None-Match itself.
 */
const MAX_PAGES = 300;

type Stored = {
	status: number;
	headers: [string, string][];
	etag: string | null;
	body: Uint8Array<ArrayBuffer> | string;
	/** The CSP nonce in the stored page, replaced by a fresh one on every answer. */
	nonce: string | null;
};

let version = '';
const pages = new Map<string, Stored>();

const NONCE = /'nonce-([^']+)'/;

function answer(stored: Stored, method: string, ifNoneMatch: string | null): Response {
	const headers = new Headers(stored.headers);
	headers.set('x-page-cache', 'hit');
	const match =
		stored.etag !== null &&
		!!ifNoneMatch?.split(',').some((t) => t.trim().replace(/^W\//, '') === stored.etag);
	if (match) return new Response(null, { status: 304, headers });
	let body = stored.body;
	if (stored.nonce && typeof body === 'string') {
		// A nonce must not repeat between answers; swap in a new one in the page and its header.
		const fresh = randomBytes(16).toString('base64');
		body = body.replaceAll(stored.nonce, fresh);
		const csp = headers.get('content-security-policy');
		if (csp) headers.set('content-security-policy', csp.replaceAll(stored.nonce, fresh));
	}
	return new Response(method === 'HEAD' ? null : body, { status: stored.status, headers });
}

export const pageCacheHandle: Handle = async ({ event, resolve }) => {
	const { request, url } = event;
	const method = request.method;
	if (
		(method !== 'GET' && method !== 'HEAD') ||
		request.headers.has('cookie') ||
		request.headers.has('authorization') ||
		!isPublicPage(url.pathname)
	) {
		return resolve(event);
	}
	const v = `${await catalogueVersion()}|${new Date().toDateString()}`;
	if (v !== version) {
		pages.clear();
		version = v;
	}
	const key = url.pathname + url.search;
	const hit = pages.get(key);
	if (hit) return answer(hit, method, request.headers.get('if-none-match'));

	const response = await resolve(event);
	if (method !== 'GET' || response.status !== 200 || response.headers.has('set-cookie')) {
		return response;
	}
	const headers = [...response.headers];
	const csp = response.headers.get('content-security-policy');
	const nonce = csp?.match(NONCE)?.[1] ?? null;
	const bytes = new Uint8Array(await response.arrayBuffer());
	const stored: Stored = {
		status: response.status,
		headers,
		etag: response.headers.get('etag'),
		body: nonce ? new TextDecoder().decode(bytes) : bytes,
		nonce
	};
	// Only keep what was rendered under the version we looked up; a page begun before an edit
	// and finished after it would otherwise outlive the edit.
	if (v === version) {
		if (pages.size >= MAX_PAGES) pages.clear();
		pages.set(key, stored);
	}
	const out = new Headers(response.headers);
	out.set('x-page-cache', 'miss');
	return new Response(bytes, { status: response.status, headers: out });
};
