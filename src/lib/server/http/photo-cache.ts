import type { Handle } from '@sveltejs/kit';
import { LRUCache } from 'lru-cache';

/**
 * Photo variants kept in memory per process. A variant's key changes whenever its photo is
 * replaced (its answer says `immutable`), yet each request went to the object store and streamed
 * the bytes through: on a page's first paint the lead photo is the largest paint, and its wait
 * for the store was the largest part of it. Entries live ten minutes, so a deleted photo stops
 * being served by every process within that time (browsers keep it a year in any case).
 */
type Kept = { body: Uint8Array<ArrayBuffer>; headers: [string, string][] };

const MAX_BYTES = 32 * 1024 * 1024;
const kept = new LRUCache<string, Kept>({
	maxSize: MAX_BYTES,
	sizeCalculation: (k) => k.body.byteLength + 512,
	ttl: 10 * 60 * 1000
});

const PHOTO = /^\/photos\/[a-z0-9][a-z0-9/_-]*\/\d+\.(webp|jpg)$/i;
/** Larger than any variant the storage module writes; anything bigger streams through. */
const MAX_ONE = 2 * 1024 * 1024;

export const photoCacheHandle: Handle = async ({ event, resolve }) => {
	const { request, url } = event;
	if (request.method !== 'GET' || !PHOTO.test(url.pathname)) return resolve(event);
	const hit = kept.get(url.pathname);
	if (hit) {
		const headers = new Headers(hit.headers);
		const etag = headers.get('etag');
		if (etag && request.headers.get('if-none-match') === etag) {
			return new Response(null, {
				status: 304,
				headers: { etag, 'cache-control': headers.get('cache-control') ?? '' }
			});
		}
		return new Response(hit.body, { status: 200, headers });
	}
	const response = await resolve(event);
	const length = Number(response.headers.get('content-length'));
	if (
		response.status !== 200 ||
		!response.headers.get('cache-control')?.includes('immutable') ||
		!(length > 0 && length <= MAX_ONE)
	) {
		return response;
	}
	const body = new Uint8Array(await response.arrayBuffer());
	kept.set(url.pathname, { body, headers: [...response.headers] });
	return new Response(body, { status: 200, headers: response.headers });
};
