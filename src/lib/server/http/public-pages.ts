/**
 * The public pages whose bytes are the same for every visitor without cookies (home, the shop
 * list with its filters, piece pages, the care page), and their client-navigation data.
 * Anything personal — a basket, an order link, an account — is not in this list.
 */
const PUBLIC_PAGES = [/^\/$/, /^\/shop(\/[^/]+)?\/?$/, /^\/care\/?$/];
const DATA_SUFFIX = /\/__data\.json$/;

export function isPublicPage(pathname: string): boolean {
	const page = pathname.replace(DATA_SUFFIX, '') || '/';
	return PUBLIC_PAGES.some((re) => re.test(page));
}
