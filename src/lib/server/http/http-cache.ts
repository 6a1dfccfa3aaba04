import { createHash } from 'node:crypto';
import type { Handle } from '@sveltejs/kit';
import { isPublicPage } from './public-pages';

/**
 * ETag and Cache-Control for the public catalogue pages seen by visitors without cookies (the
 * same bytes for every such visitor). A browser coming back sends If-None-Match and gets a 304
 * with no body; `no-cache` makes it ask every time, so a price or stock change shows at once.
 * Anything personal — a signed-in visitor, a basket, an order link — is left alone.
 */
export const httpCacheHandle: Handle = async ({ event, resolve }) => {
	const { request, url } = event;
	const cacheable =
		(request.method === 'GET' || request.method === 'HEAD') &&
		!request.headers.has('cookie') &&
		isPublicPage(url.pathname);
	const response = await resolve(event);
	if (!cacheable || response.status !== 200 || response.headers.has('set-cookie')) {
		return response;
	}
	// The policy names the inline script by hash, so the same page gives the same tag.
	const body = new Uint8Array(await response.arrayBuffer());
	const etag = `"${createHash('sha1').update(body).digest('base64url')}"`;
	const headers = new Headers(response.headers);
	headers.set('etag', etag);
	if (!headers.has('cache-control')) headers.set('cache-control', 'public, no-cache');
	headers.append('vary', 'Cookie');
	const match = request.headers
		.get('if-none-match')
		?.split(',')
		.some((t) => t.trim().replace(/^W\//, '') === etag);
	if (match) return new Response(null, { status: 304, headers });
	return new Response(body, { status: 200, headers });
};
