/**
 * The page cache's key. What SvelteKit sends and reads is taken from its own runtime
 * (@sveltejs/kit 2, src/runtime/server/respond.js and data/index.js): client navigation fetches
 * `<path>/__data.json`, with `x-sveltekit-invalidated` as one character per layout/page node
 * ('1' reloads the node, anything else does not; absent reloads all) and
 * `x-sveltekit-trailing-slash=1` for an address that ended in '/'. Queries are parsed as the
 * WHATWG URL standard says (URLSearchParams), percent-decoding as RFC 3986 §2.1.
 */
import { describe, expect, it } from 'vitest';
import { canonicalShopQuery, fitsRequest, pageCacheKey } from '$lib/server/http/page-cache-key';

const WOODS = new Set(['basswood', 'black-walnut']);
const key = (address: string) => pageCacheKey(new URL(address, 'http://shop.test'), WOODS);

describe('page cache key', () => {
	it('keeps a page and its data request apart, on every public page', () => {
		for (const [page, data] of [
			['/', '/__data.json'],
			['/shop', '/shop/__data.json'],
			['/shop/spoon-rack', '/shop/spoon-rack/__data.json'],
			['/care', '/care/__data.json']
		]) {
			const p = key(page)!;
			const d = key(`${data}?x-sveltekit-invalidated=011`)!;
			expect(p.data).toBe(false);
			expect(d.data).toBe(true);
			expect(p.key).not.toBe(d.key);
		}
	});

	it("counts SvelteKit's reload flags on a data request, as its runtime reads them", () => {
		const all = key('/shop/__data.json')!.key;
		expect(key('/shop/__data.json?x-sveltekit-invalidated=1111')!.key).toBe(all);
		const pageOnly = key('/shop/__data.json?x-sveltekit-invalidated=001')!.key;
		expect(pageOnly).not.toBe(all);
		// 'x' and '0' both mean "keep"; a missing trailing character also means "keep".
		expect(key('/shop/__data.json?x-sveltekit-invalidated=xx1')!.key).toBe(pageOnly);
		expect(key('/shop/__data.json?x-sveltekit-invalidated=0010')!.key).toBe(pageOnly);
	});

	it('gives addresses that differ only in parameters the page does not read one entry', () => {
		expect(key('/shop?utm_source=a&zz=1')!.key).toBe(key('/shop')!.key);
		expect(key('/shop/spoon-rack?ref=mail')!.key).toBe(key('/shop/spoon-rack')!.key);
		expect(key('/care?x=' + 'y'.repeat(500))!.key).toBe(key('/care')!.key);
		expect(key('/?a=1')!.key).toBe(key('/')!.key);
		// Order and junk around the filters do not matter; the filters do.
		const filtered = key('/shop?kind=plate&wood=basswood')!.key;
		expect(key('/shop?junk=1&wood=basswood&kind=plate&x=2')!.key).toBe(filtered);
		expect(filtered).not.toBe(key('/shop')!.key);
	});

	it('reads the filters as the shop does: defaults and unknown values are the unfiltered shop', () => {
		const p = (q: string) => canonicalShopQuery(new URLSearchParams(q), WOODS);
		expect(p('sort=featured')).toBe('');
		expect(p('sort=nonsense&ready=yes')).toBe('');
		expect(p('wood=made-up-wood')).toBe('');
		expect(p('wood=BASSWOOD')).toBe('');
		expect(p('ready=1&sort=price-low&wood=black-walnut')).toBe(
			'wood=black-walnut&ready=1&sort=price-low'
		);
	});

	it('treats a percent-encoded path as the path the router sees', () => {
		expect(key('/shop/spoon-r%61ck')!.key).toBe(key('/shop/spoon-rack')!.key);
		expect(key('/shop/%E0%A4%A')).toBeNull();
	});

	it('leaves everything personal out', () => {
		for (const address of [
			'/cart',
			'/cart/__data.json',
			'/checkout',
			'/account',
			'/orders/ABC123?k=secret',
			'/workshop',
			'/api/pattern',
			'/shop/a/b',
			'/__data.json/__data.json'
		]) {
			expect(key(address), address).toBeNull();
		}
	});

	it('stores JSON only for data requests and HTML only for pages', () => {
		expect(fitsRequest('text/html; charset=utf-8', false)).toBe(true);
		expect(fitsRequest('application/json', false)).toBe(false);
		expect(fitsRequest('application/json; charset=utf-8', true)).toBe(true);
		expect(fitsRequest('text/html', true)).toBe(false);
		// Streamed data (promises in a load) is not kept whole.
		expect(fitsRequest('text/sveltekit-data', true)).toBe(false);
		expect(fitsRequest(null, false)).toBe(false);
	});
});
