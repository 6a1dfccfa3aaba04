import { apiError } from '$lib/server/http/api-errors';
import { letterFont } from '$lib/pattern/letter-font';
import { patternJson } from '$lib/server/pattern/api';
import { throttles } from '$lib/server/http/throttles';
import type { RequestHandler } from './$types';

/** Public: the layout for a set of rosette settings, the same the preview draws. */
export const GET: RequestHandler = async ({ url, getClientAddress }) => {
	// Per client, so one caller cannot keep the CPU from the shop (RFC 6585 §4: 429).
	const verdict = await throttles.pattern.take(getClientAddress());
	if (!verdict.ok) {
		const res = apiError(
			429,
			`Too many pattern requests. Please wait ${verdict.retryAfterS} seconds and try again.`
		);
		res.headers.set('retry-after', String(verdict.retryAfterS));
		return res;
	}
	const { status, text } = patternJson(url.searchParams, letterFont());
	return new Response(text, {
		status,
		headers: {
			'content-type': 'application/json',
			...(status === 200 ? { 'cache-control': 'public, max-age=300' } : {})
		}
	});
};
