/**
 * What search engines and link previews read: the Product JSON-LD carries the properties
 * schema.org defines for Product (name, description, image, sku, url, brand, offers) and Offer
 * (price, priceCurrency, availability as an ItemAvailability member, url) — checked against
 * https://schema.org/Product, https://schema.org/Offer and https://schema.org/ItemAvailability;
 * `price` is a decimal with a full stop and no currency sign, as schema.org's Offer asks.
 * robots.txt follows RFC 9309, sitemap.xml the sitemaps.org 0.9 protocol, favicon.ico the ICO
 * layout Microsoft documents (read back, and its PNGs decoded with sharp).
 */
import { readFileSync } from 'node:fs';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { ldPrice, productJsonLd, scriptJson } from '$lib/seo/product-ld';
import { metaDescription } from '$lib/seo/describe';
import { robotsTxt } from '$lib/seo/robots';
import { sitemapXml } from '$lib/seo/sitemap';
import { readIcoEntries } from '$lib/seo/ico';

/** Properties schema.org lists for Product and Offer (a subset of each type's own table). */
const PRODUCT_PROPS = new Set(['name', 'description', 'image', 'sku', 'url', 'brand', 'offers']);
const OFFER_PROPS = new Set([
	'url',
	'price',
	'priceCurrency',
	'availability',
	'itemCondition',
	'seller'
]);
const AVAILABILITY = new Set(
	[
		'BackOrder',
		'Discontinued',
		'InStock',
		'InStoreOnly',
		'LimitedAvailability',
		'MadeToOrder',
		'OnlineOnly',
		'OutOfStock',
		'PreOrder',
		'PreSale',
		'Reserved',
		'SoldOut'
	].map((m) => `https://schema.org/${m}`)
);

const facts = {
	slug: 'rosette-plate',
	title: 'Rosette plate </script>',
	summary: 'A plate.',
	currency: 'USD',
	fromMinor: 4850,
	personalisable: false,
	inStock: 2,
	images: ['http://localhost/photos/a/1600.jpg'],
	url: 'http://localhost/shop/rosette-plate',
	shop: 'The shop'
};

describe('Product JSON-LD', () => {
	it('uses only Product and Offer properties, with price, currency and availability', () => {
		const ld = productJsonLd(facts);
		expect(ld['@context']).toBe('https://schema.org');
		expect(ld['@type']).toBe('Product');
		for (const k of Object.keys(ld).filter((k) => !k.startsWith('@')))
			expect(PRODUCT_PROPS.has(k), k).toBe(true);
		expect(ld.offers['@type']).toBe('Offer');
		for (const k of Object.keys(ld.offers).filter((k) => !k.startsWith('@')))
			expect(OFFER_PROPS.has(k), k).toBe(true);
		expect(ld.offers.price).toBe('48.50');
		expect(ld.offers.priceCurrency).toMatch(/^[A-Z]{3}$/); // ISO 4217
		expect(AVAILABILITY.has(ld.offers.availability)).toBe(true);
		expect(ld.offers.availability).toBe('https://schema.org/InStock');
	});

	it('says MadeToOrder for personalised pieces and OutOfStock for an empty shelf', () => {
		expect(productJsonLd({ ...facts, personalisable: true }).offers.availability).toBe(
			'https://schema.org/MadeToOrder'
		);
		expect(productJsonLd({ ...facts, inStock: 0 }).offers.availability).toBe(
			'https://schema.org/OutOfStock'
		);
	});

	it('writes prices in major units with the currency’s digits (ISO 4217)', () => {
		expect(ldPrice(4850, 'USD')).toBe('48.50');
		expect(ldPrice(1500, 'JPY')).toBe('1500');
		expect(ldPrice(12345, 'KWD')).toBe('12.345');
	});

	it('cannot close its script element early and parses back to the same object', () => {
		const text = scriptJson(productJsonLd(facts));
		expect(text).not.toContain('</script');
		expect(JSON.parse(text)).toEqual(productJsonLd(facts));
	});
});

describe('meta description', () => {
	it('keeps short text whole and cuts long text at a word with an ellipsis', () => {
		expect(metaDescription('  A  plate\nfor bread. ')).toBe('A plate for bread.');
		const long = metaDescription('word '.repeat(60));
		expect(long.length).toBeLessThanOrEqual(155);
		expect(long.endsWith('word…')).toBe(true);
	});
});

describe('robots.txt and sitemap.xml', () => {
	it('keeps the workshop, basket, checkout and order links out and names the sitemap', () => {
		const lines = robotsTxt('https://shop.example').split('\n');
		expect(lines[0]).toBe('User-agent: *');
		for (const p of ['/workshop', '/cart', '/checkout', '/orders/'])
			expect(lines).toContain(`Disallow: ${p}`);
		expect(lines).toContain('Sitemap: https://shop.example/sitemap.xml');
	});

	it('lists the public pages and each piece with absolute, escaped addresses', () => {
		const xml = sitemapXml('https://shop.example', ['rosette-plate', 'a&b']);
		expect(xml.startsWith('<?xml version="1.0" encoding="UTF-8"?>')).toBe(true);
		expect(xml).toContain('<urlset xmlns="http://www.sitemaps.org/schemas/sitemap/0.9">');
		const locs = [...xml.matchAll(/<loc>(.*?)<\/loc>/g)].map((m) => m[1]);
		expect(locs).toContain('https://shop.example/shop/rosette-plate');
		expect(locs).toContain('https://shop.example/shop/a%26b');
		expect(locs.every((l) => l.startsWith('https://shop.example/'))).toBe(true);
		expect(locs.some((l) => /workshop|cart|checkout|orders/.test(l))).toBe(false);
	});
});

describe('icons', () => {
	it('favicon.ico holds 16, 32 and 48 px PNGs that decode to their stated size', async () => {
		const bytes = readFileSync('static/favicon.ico');
		const entries = readIcoEntries(bytes)!;
		expect(entries.map((e) => e.width)).toEqual([16, 32, 48]);
		for (const e of entries) {
			const png = bytes.subarray(e.offset, e.offset + e.length);
			// The PNG signature (ISO/IEC 15948): 89 50 4E 47 0D 0A 1A 0A.
			expect([...png.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
			const meta = await sharp(png).metadata();
			expect([meta.width, meta.height]).toEqual([e.width, e.height]);
		}
	});

	it('the PNG icons have their sizes', async () => {
		for (const [file, size] of [
			['apple-touch-icon.png', 180],
			['icon-192.png', 192],
			['icon-512.png', 512]
		] as const) {
			const meta = await sharp(`static/${file}`).metadata();
			expect([meta.format, meta.width, meta.height], file).toEqual(['png', size, size]);
		}
	});
});
