import { listPieces, woodFilterOptions } from '$lib/server/catalogue/catalogue';
import { parseShopQuery } from '$lib/catalogue/shop-query';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ url }) => {
	const woods = await woodFilterOptions();
	const asked = parseShopQuery(url.searchParams);
	// A wood no piece is made of shows the whole shop, as the page cache's key reads it
	// (server/http/page-cache-key.ts), so made-up woods cannot each become a page of their own.
	const query = woods.some((w) => w.slug === asked.wood) ? asked : { ...asked, wood: undefined };
	return { query, pieces: await listPieces(query), woods };
};
