import { expect, test } from '@playwright/test';

/**
 * What a shared link and a search engine see: the piece page's preview-card tags (Open Graph,
 * ogp.me) with the lead photo, its schema.org Product JSON-LD (https://schema.org/Product,
 * https://schema.org/Offer), robots.txt (RFC 9309), sitemap.xml (sitemaps.org 0.9, parsed by
 * the browser's own XML parser) and the icons.
 */
const PIECE = '/shop/rosette-bottle-holder';

test('a piece page carries its preview card and its product data', async ({ page, request }) => {
	await page.goto(PIECE);
	const meta = (p: string) => page.locator(`meta[property="${p}"]`).getAttribute('content');
	expect(await meta('og:title')).toBeTruthy();
	expect(await meta('og:type')).toBe('product');
	const image = (await meta('og:image'))!;
	expect(image).toMatch(/^https?:\/\/.+\/photos\/.+\/1600\.jpg$/);
	const photo = await request.get(new URL(image).pathname);
	expect(photo.status()).toBe(200);
	expect(photo.headers()['content-type']).toContain('image/jpeg');
	expect(await page.locator('meta[name="description"]').getAttribute('content')).toBeTruthy();

	const ld = JSON.parse(
		(await page.locator('script[type="application/ld+json"]').textContent())!
	) as { '@type': string; name: string; offers: Record<string, string> };
	expect(ld['@type']).toBe('Product');
	expect(ld.offers['@type']).toBe('Offer');
	expect(ld.offers.price).toMatch(/^\d+(\.\d+)?$/);
	expect(ld.offers.priceCurrency).toBe('USD');
	expect(ld.offers.availability).toMatch(
		/^https:\/\/schema\.org\/(InStock|OutOfStock|MadeToOrder)$/
	);
	expect(ld.name).toBe(await meta('og:title'));
});

test('every public page has a meta description', async ({ page }) => {
	for (const path of ['/', '/shop', '/care', '/contact', '/policies', '/fairs']) {
		await page.goto(path);
		const d = await page.locator('meta[name="description"]').getAttribute('content');
		expect(d?.length, path).toBeGreaterThan(40);
	}
});

test('robots.txt keeps private pages out; sitemap.xml lists the catalogue', async ({ page }) => {
	const robots = await (await page.request.get('/robots.txt')).text();
	for (const p of ['/workshop', '/cart', '/checkout', '/orders/'])
		expect(robots).toContain(`Disallow: ${p}`);
	const res = await page.request.get('/sitemap.xml');
	expect(res.headers()['content-type']).toContain('application/xml');
	const xml = await res.text();
	await page.goto('/');
	const locs = await page.evaluate((text) => {
		const doc = new DOMParser().parseFromString(text, 'application/xml');
		if (doc.querySelector('parsererror')) return null;
		const root = doc.documentElement;
		return {
			ns: root.namespaceURI,
			locs: [...doc.getElementsByTagName('loc')].map((l) => l.textContent ?? '')
		};
	}, xml);
	expect(locs?.ns).toBe('http://www.sitemaps.org/schemas/sitemap/0.9');
	expect(locs?.locs.some((l) => l.endsWith(PIECE))).toBe(true);
	expect(locs?.locs.some((l) => /\/(workshop|cart|checkout|orders)/.test(l))).toBe(false);
});

test('favicon.ico and the icons answer', async ({ request }) => {
	const ico = await request.get('/favicon.ico');
	expect(ico.status()).toBe(200);
	// ICO header: reserved 0, type 1 (icon).
	expect([...(await ico.body()).subarray(0, 4)]).toEqual([0, 0, 1, 0]);
	for (const f of ['/apple-touch-icon.png', '/icon-192.png', '/icon-512.png']) {
		const r = await request.get(f);
		expect(r.status(), f).toBe(200);
		expect(r.headers()['content-type'], f).toContain('image/png');
	}
});
