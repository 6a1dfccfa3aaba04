import { parseShopQuery } from '$lib/catalogue/shop-query';
import { isPublicPage } from './public-pages';

/**
 * What a request to a public page really asks for, as the page cache's key.
 *
 * SvelteKit strips `/__data.json` and its own query parameters from `event.url`, so the key is
 * built from the address the client sent (`event.request.url`): a page and its data never share
 * an entry. The query counts only through what the page reads — the shop's filters, normalised
 * the way the shop's load reads them, and SvelteKit's "which nodes to reload" flags on a data
 * request — so addresses that differ only in parameters nobody reads share one entry and cannot
 * evict or bypass the real pages.
 */
export type CacheRequest = {
	key: string;
	/** A client-navigation data request (`…/__data.json`), answered with JSON, never HTML. */
	data: boolean;
	/** A piece page: its ready-by date follows the carving queue, which orders move. */
	piece: boolean;
};

const DATA_SUFFIX = '/__data.json';
const INVALIDATED = 'x-sveltekit-invalidated';
const TRAILING_SLASH = 'x-sveltekit-trailing-slash';
/** Layout and page nodes of a public page (root layout, shop layout, page) and one to spare. */
const NODE_FLAGS = 4;

/** The shop list's filters as a canonical query string ('' for the unfiltered list). */
export function canonicalShopQuery(params: URLSearchParams, knownWoods: ReadonlySet<string>) {
	const q = parseShopQuery(params);
	const parts: string[] = [];
	if (q.kind) parts.push(`kind=${q.kind}`);
	// A wood no piece is made of shows the whole shop (the shop's load drops it the same way).
	if (q.wood && knownWoods.has(q.wood)) parts.push(`wood=${q.wood}`);
	if (q.ready) parts.push('ready=1');
	if (q.sort !== 'featured') parts.push(`sort=${q.sort}`);
	return parts.join('&');
}

/** SvelteKit's per-node reload flags, as it reads them: '1' reloads a node, anything else not. */
function nodeFlags(value: string | null): string {
	if (value === null) return '1'.repeat(NODE_FLAGS);
	let flags = '';
	for (let i = 0; i < NODE_FLAGS; i++) flags += value[i] === '1' ? '1' : '0';
	return flags;
}

/**
 * The cache key for a GET of `url` (the address as the client sent it), or null when the
 * address is not a public page (it is then rendered as usual and never stored).
 */
export function pageCacheKey(url: URL, knownWoods: ReadonlySet<string>): CacheRequest | null {
	let path: string;
	try {
		// `/shop/bow%6c` is the same page as `/shop/bowl` to the router.
		path = decodeURI(url.pathname);
	} catch {
		return null;
	}
	const data = path.endsWith(DATA_SUFFIX);
	let page = data ? path.slice(0, -DATA_SUFFIX.length) || '/' : path;
	if (data && url.searchParams.get(TRAILING_SLASH) === '1' && page !== '/') page += '/';
	if (!isPublicPage(page) || page.includes('__data.json')) return null;
	const query = page === '/shop' ? canonicalShopQuery(url.searchParams, knownWoods) : '';
	const flags = data ? ` ${nodeFlags(url.searchParams.get(INVALIDATED))}` : '';
	const piece = /^\/shop\/[^/]+\/?$/.test(page);
	return { key: `${data ? 'data' : 'page'} ${page}?${query}${flags}`, data, piece };
}

/** Whether a stored answer's content type fits the request: JSON for data, HTML for a page. */
export function fitsRequest(contentType: string | null, data: boolean): boolean {
	const type = (contentType ?? '').split(';')[0].trim().toLowerCase();
	return data ? type === 'application/json' : type === 'text/html';
}
