import { z } from 'zod';
import { pieceKinds } from '$lib/catalogue/kinds';

export const SHOP_SORTS = ['featured', 'price-low', 'price-high', 'newest'] as const;
export type ShopSort = (typeof SHOP_SORTS)[number];

/** Shop filters from the query string; anything malformed falls back instead of failing. */
export const shopQuery = z.object({
	kind: z.enum(pieceKinds).optional().catch(undefined),
	wood: z
		.string()
		.regex(/^[a-z][a-z-]{0,39}$/)
		.optional()
		.catch(undefined),
	ready: z
		.enum(['1'])
		.optional()
		.catch(undefined)
		.transform((v) => v === '1'),
	sort: z.enum(SHOP_SORTS).catch('featured')
});

export type ShopQuery = z.infer<typeof shopQuery>;

export function parseShopQuery(params: URLSearchParams): ShopQuery {
	return shopQuery.parse({
		kind: params.get('kind') ?? undefined,
		wood: params.get('wood') ?? undefined,
		ready: params.get('ready') ?? undefined,
		sort: params.get('sort') ?? undefined
	});
}
