import { config } from '$lib/server/config';
import { robotsTxt } from '$lib/seo/robots';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = () =>
	new Response(robotsTxt(config.origin), {
		headers: {
			'content-type': 'text/plain; charset=utf-8',
			'cache-control': 'public, max-age=3600'
		}
	});
