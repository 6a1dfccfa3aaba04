import { listPieces, woodFilterOptions } from '$lib/server/catalogue';
import { parseShopQuery } from '$lib/schemas/shop';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ url }) => {
	const query = parseShopQuery(url.searchParams);
	const [pieces, woods] = await Promise.all([listPieces(query), woodFilterOptions()]);
	return { query, pieces, woods };
};
