/**
 * robots.txt (RFC 9309): every crawler may read the shop, none the workshop, the basket, the
 * checkout, buyers' order links, accounts, sign-in or the API. Those pages are private or
 * per visitor; an order link carries its own key and must never turn up in a search result.
 */
export const PRIVATE_PATHS = [
	'/workshop',
	'/cart',
	'/checkout',
	'/orders/',
	'/account',
	'/signin',
	'/signup',
	'/signout',
	'/reset',
	'/api/'
] as const;

export function robotsTxt(origin: string): string {
	return [
		'User-agent: *',
		'Allow: /',
		...PRIVATE_PATHS.map((p) => `Disallow: ${p}`),
		'',
		`Sitemap: ${origin}/sitemap.xml`,
		''
	].join('\n');
}
