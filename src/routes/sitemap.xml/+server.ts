import { config } from '$lib/server/config';
import { activePieceSlugs } from '$lib/server/seo/piece-slugs';
import { sitemapXml } from '$lib/seo/sitemap';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async () =>
	new Response(sitemapXml(config.origin, await activePieceSlugs()), {
		headers: {
			'content-type': 'application/xml; charset=utf-8',
			'cache-control': 'public, max-age=600'
		}
	});
