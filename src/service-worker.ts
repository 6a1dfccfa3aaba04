/// <reference types="@sveltejs/kit" />
/// <reference no-default-lib="true"/>
/// <reference lib="esnext" />
/// <reference lib="webworker" />
/**
 * Lets a helper work with no signal. The app's built files and the offline page are stored at
 * install. The pages a helper needs at the booth (the booth start page, each fair's booth and
 * tally) are kept whenever they open with signal — the page and its data, so both a reload and
 * an in-app tap work without signal. Any other workshop page, without signal, shows the offline
 * page (which says what still works) instead of an error. The shop is left to the network.
 */
import { build, files, version } from '$service-worker';
import { KEPT_PAGES, OFFLINE_PAGE, isKeptPage, offlineAddress } from '$lib/offline/offline-pages';

const sw = self as unknown as ServiceWorkerGlobalScope;
const ASSETS_CACHE = `chipstall-assets-${version}`;
const ASSETS = new Set([...build, ...files]);
const DATA = '/__data.json';
const INVALIDATED = 'x-sveltekit-invalidated';

sw.addEventListener('install', (event) => {
	event.waitUntil(
		caches
			.open(ASSETS_CACHE)
			.then((c) => c.addAll([...ASSETS, OFFLINE_PAGE]))
			.then(() => sw.skipWaiting())
	);
});

sw.addEventListener('activate', (event) => {
	event.waitUntil(
		caches
			.keys()
			.then((keys) =>
				Promise.all(
					keys
						// Kept pages name the old build's files, which go with the old cache.
						.filter(
							(k) => (k.startsWith('chipstall-assets-') && k !== ASSETS_CACHE) || k === KEPT_PAGES
						)
						.map((k) => caches.delete(k))
				)
			)
			.then(() => sw.clients.claim())
	);
});

/** The address a kept response is stored under: SvelteKit's own query parameter left out. */
function keyOf(url: URL): string {
	const u = new URL(url);
	u.searchParams.delete(INVALIDATED);
	return u.href;
}

function dataUrlOf(page: URL): URL {
	const u = new URL(page);
	u.pathname = u.pathname.replace(/\/$/, '') + DATA;
	return u;
}

/** Told to SvelteKit's router as a redirect, so an in-app tap lands on the offline page. */
function offlineData(from: string): Response {
	const body = JSON.stringify({ type: 'redirect', location: offlineAddress(from) });
	return new Response(body + '\n', { headers: { 'content-type': 'application/json' } });
}

async function offlinePage(): Promise<Response> {
	const hit = await caches.match(OFFLINE_PAGE);
	return (
		hit ??
		new Response('No signal. Open the booth again when the phone has signal.', {
			status: 503,
			headers: { 'content-type': 'text/plain; charset=utf-8' }
		})
	);
}

/** Stores a good answer; a redirect (signed out) or an error is never kept. */
async function keep(key: string, res: Response) {
	if (!res.ok || res.redirected || res.type !== 'basic') return;
	const text = await res.clone().text();
	if (text.startsWith('{"type":"redirect"')) return;
	const cache = await caches.open(KEPT_PAGES);
	await cache.put(key, new Response(text, { status: res.status, headers: res.headers }));
}

async function keptPage(event: FetchEvent, url: URL, from: string, isData: boolean) {
	const key = keyOf(url);
	try {
		// Data is asked for whole (every layout's), so the stored copy answers any later tap.
		const res = await fetch(isData ? new Request(key) : event.request);
		event.waitUntil(keep(key, res.clone()));
		if (!isData && res.ok) {
			const data = dataUrlOf(url);
			event.waitUntil(
				fetch(data.href)
					.then((r) => keep(data.href, r))
					.catch(() => {})
			);
		}
		return res;
	} catch {
		const hit = await caches.match(key, { cacheName: KEPT_PAGES });
		if (hit) return hit;
		return isData ? offlineData(from) : offlinePage();
	}
}

sw.addEventListener('fetch', (event) => {
	const req = event.request;
	const url = new URL(req.url);
	if (url.origin !== sw.location.origin) return;
	if (req.method === 'POST' && url.pathname === '/signout') {
		// Pages kept for one person are not shown to the next one on this phone.
		event.waitUntil(caches.delete(KEPT_PAGES));
		return;
	}
	if (req.method !== 'GET') return;
	if (ASSETS.has(url.pathname)) {
		event.respondWith(caches.match(url.pathname).then((hit) => hit ?? fetch(req)));
		return;
	}
	if (!url.pathname.startsWith('/workshop')) return;
	const isData = url.pathname.endsWith(DATA);
	const page = isData ? url.pathname.slice(0, -DATA.length) || '/' : url.pathname;
	const from = page + new URL(keyOf(url)).search;
	if (isKeptPage(page)) {
		event.respondWith(keptPage(event, url, from, isData));
	} else if (isData) {
		event.respondWith(fetch(req).catch(() => offlineData(from)));
	} else if (req.mode === 'navigate') {
		event.respondWith(fetch(req).catch(() => offlinePage()));
	}
});
