/// <reference types="@sveltejs/kit" />
/// <reference no-default-lib="true"/>
/// <reference lib="esnext" />
/// <reference lib="webworker" />
/**
 * Lets the booth screen load with no signal: the app's built files are cached at install, and
 * each booth page is cached by the page itself (BOOTH_PAGES) when it opens online. Nothing else
 * is touched: the shop and the rest of the workshop always go to the network.
 */
import { build, files, version } from '$service-worker';

const sw = self as unknown as ServiceWorkerGlobalScope;
const ASSETS_CACHE = `chipstall-assets-${version}`;
const BOOTH_PAGES = 'chipstall-booth-pages';
const ASSETS = new Set([...build, ...files]);
const BOOTH = /^\/workshop\/fairs\/\d+\/booth\/?$/;

sw.addEventListener('install', (event) => {
	event.waitUntil(
		caches
			.open(ASSETS_CACHE)
			.then((c) => c.addAll([...ASSETS]))
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
						.filter((k) => k.startsWith('chipstall-assets-') && k !== ASSETS_CACHE)
						.map((k) => caches.delete(k))
				)
			)
			.then(() => sw.clients.claim())
	);
});

sw.addEventListener('fetch', (event) => {
	const req = event.request;
	if (req.method !== 'GET') return;
	const url = new URL(req.url);
	if (url.origin !== sw.location.origin) return;
	if (ASSETS.has(url.pathname)) {
		event.respondWith(caches.match(url.pathname).then((hit) => hit ?? fetch(req)));
		return;
	}
	if (BOOTH.test(url.pathname) && req.mode === 'navigate') {
		// Network first so prices and counts are fresh; the stored copy when there is no signal.
		event.respondWith(
			fetch(req)
				.then(async (res) => {
					if (res.ok) await (await caches.open(BOOTH_PAGES)).put(url.pathname, res.clone());
					return res;
				})
				.catch(async () => {
					const hit = await caches.match(url.pathname);
					return (
						hit ??
						new Response('No signal, and this booth was not opened here before.', { status: 503 })
					);
				})
		);
	}
});
