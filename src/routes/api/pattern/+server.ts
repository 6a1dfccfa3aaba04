import { json } from '@sveltejs/kit';
import { letterFont } from '$lib/pattern/letter-font';
import { patternResponse } from '$lib/server/pattern-api';
import type { RequestHandler } from './$types';

/** Public: the layout for a set of rosette settings, the same the preview draws. */
export const GET: RequestHandler = ({ url }) => {
	const { status, body } = patternResponse(url.searchParams, letterFont());
	return json(body, {
		status,
		headers: status === 200 ? { 'cache-control': 'public, max-age=300' } : {}
	});
};
