/**
 * sitemap.xml in the sitemaps.org 0.9 protocol: one `<url>` per public page and per piece in
 * the catalogue, absolute addresses, XML-escaped. Small shops stay far under the protocol's
 * 50,000 addresses per file.
 */
export const PUBLIC_PAGES = ['/', '/shop', '/care', '/fairs', '/contact', '/policies'] as const;

const xmlEscape = (s: string) =>
	s.replace(
		/[&<>"']/g,
		(c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[c]!
	);

export function sitemapXml(origin: string, pieceSlugs: string[]): string {
	const urls = [
		...PUBLIC_PAGES.map((p) => `${origin}${p === '/' ? '/' : p}`),
		...pieceSlugs.map((s) => `${origin}/shop/${encodeURIComponent(s)}`)
	];
	return [
		'<?xml version="1.0" encoding="UTF-8"?>',
		'<urlset xmlns="http://www.sitemaps.org/schemas/sitemap/0.9">',
		...urls.map((u) => `<url><loc>${xmlEscape(u)}</loc></url>`),
		'</urlset>',
		''
	].join('\n');
}
