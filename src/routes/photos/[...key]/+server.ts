import { error } from '@sveltejs/kit';
import { getObject } from '$lib/server/catalogue/photo-storage';
import type { RequestHandler } from './$types';

const MAX_KEY_LENGTH = 300;

/** Serves stored photo variants, e.g. /photos/pieces/rosette-plate/a1b2/800.webp (or .jpg). */
export const GET: RequestHandler = async ({ params, request }) => {
	const key = params.key;
	// Only the variants storePhoto writes; nothing else in the bucket is public. Their keys are
	// short; S3 refuses keys over 1,024 bytes, so a longer one is answered here.
	if (key.length > MAX_KEY_LENGTH) error(404, 'No such photo');
	if (!/^[a-z0-9][a-z0-9/_-]*\/\d+\.(webp|jpg)$/i.test(key) || key.includes('..'))
		error(404, 'No such photo');
	const obj = await getObject(key);
	if (!obj) error(404, 'No such photo');

	const headers: Record<string, string> = {
		'content-type': obj.contentType,
		// Variant keys change when a photo is replaced, so they can be cached for long.
		'cache-control': 'public, max-age=31536000, immutable'
	};
	if (obj.etag) headers.etag = obj.etag;
	if (obj.contentLength !== undefined) headers['content-length'] = String(obj.contentLength);
	if (obj.lastModified) headers['last-modified'] = obj.lastModified.toUTCString();

	if (obj.etag && request.headers.get('if-none-match') === obj.etag) {
		await obj.body.cancel();
		return new Response(null, {
			status: 304,
			headers: { etag: obj.etag, 'cache-control': headers['cache-control'] }
		});
	}
	return new Response(obj.body, { headers });
};
