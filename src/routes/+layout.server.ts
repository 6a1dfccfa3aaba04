import { shopFormat, shopWords } from '$lib/locale/shop-format';
import type { LayoutServerLoad } from './$types';

/**
 * The shop's clock, money and words for the browser's formatters. Shop-wide (the same for every
 * visitor), so pages that carry it can be cached.
 */
export const load: LayoutServerLoad = () => ({ shopFormat: shopFormat(), shopWords: shopWords() });
