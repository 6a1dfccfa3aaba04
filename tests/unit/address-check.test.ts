import { describe, expect, it } from 'vitest';
import { isFormWrite, otherHost, refusal, rightAddress } from '$lib/server/http/address';

const ORIGIN = new URL('http://localhost:3000');

const req = (url: string, init: RequestInit & { headers?: Record<string, string> } = {}) =>
	new Request(url, init);

describe('which requests the cross-site form check covers', () => {
	// The three encodings an HTML form can send (WHATWG HTML, "form submission": the enctype
	// attribute's keywords), which reach another origin without a CORS preflight (Fetch standard,
	// "CORS-safelisted request-header": Content-Type), plus SvelteKit's own form encoding.
	it('covers every form encoding, whatever its parameters or case', () => {
		for (const type of [
			'application/x-www-form-urlencoded',
			'multipart/form-data; boundary=----x',
			'text/plain;charset=UTF-8',
			'Application/X-WWW-Form-Urlencoded',
			'application/x-sveltekit-formdata'
		]) {
			expect(
				isFormWrite(
					req('http://localhost:3000/signin', { method: 'POST', headers: { 'content-type': type } })
				),
				type
			).toBe(true);
		}
	});

	it('covers POST, PUT, PATCH and DELETE, not reads', () => {
		const form = { 'content-type': 'application/x-www-form-urlencoded' };
		for (const method of ['POST', 'PUT', 'PATCH', 'DELETE'])
			expect(isFormWrite(req('http://localhost:3000/x', { method, headers: form }))).toBe(true);
		for (const method of ['GET', 'HEAD', 'OPTIONS'])
			expect(isFormWrite(req('http://localhost:3000/x', { method, headers: form }))).toBe(false);
	});

	it('leaves JSON to the API (a cross-site JSON post needs a CORS preflight the app never grants)', () => {
		const json = req('http://localhost:3000/api/cart', {
			method: 'POST',
			headers: { 'content-type': 'application/json' }
		});
		expect(isFormWrite(json)).toBe(false);
	});
});

describe('the address the browser used', () => {
	it('names another host, and nothing when the Host is the origin’s (RFC 9110 §7.2: host and port)', () => {
		const at = (host: string, extra: Record<string, string> = {}) =>
			otherHost(req('http://localhost:3000/shop', { headers: { host, ...extra } }), ORIGIN);
		expect(at('localhost:3000')).toBeNull();
		expect(at('LOCALHOST:3000')).toBeNull();
		expect(at('127.0.0.1:3000')).toBe('127.0.0.1:3000');
		expect(at('[::1]:3000')).toBe('[::1]:3000');
		// Same name, other port: another address all the same.
		expect(at('localhost:3001')).toBe('localhost:3001');
		// A proxy in front that says the visitor used the right host: no redirect round again.
		expect(at('127.0.0.1:3000', { 'x-forwarded-host': 'localhost:3000' })).toBeNull();
		expect(at('127.0.0.1:3000', { 'x-forwarded-host': 'elsewhere.test' })).toBe('127.0.0.1:3000');
	});
});

describe('where a refused form sends the visitor', () => {
	it('to the page they were on, when it came from this server under another name', () => {
		const r = req('http://localhost:3000/shop/rosette-bottle-holder?/add', {
			method: 'POST',
			headers: {
				host: '127.0.0.1:3000',
				origin: 'http://127.0.0.1:3000',
				referer: 'http://127.0.0.1:3000/shop/rosette-bottle-holder?wood=cherry'
			}
		});
		expect(rightAddress(r, ORIGIN)).toBe(
			'http://localhost:3000/shop/rosette-bottle-holder?wood=cherry'
		);
	});

	it("to the form's own page, never a path another site names", () => {
		const r = req('http://localhost:3000/signin', {
			method: 'POST',
			headers: {
				host: 'localhost:3000',
				origin: 'http://elsewhere.test',
				referer: 'http://elsewhere.test/%2F%2Fevil'
			}
		});
		expect(rightAddress(r, ORIGIN)).toBe('http://localhost:3000/signin');
	});
});

describe('the refusal', () => {
	const post = (path: string, headers: Record<string, string>) =>
		req(`http://localhost:3000${path}`, {
			method: 'POST',
			headers: {
				'content-type': 'application/x-www-form-urlencoded',
				host: 'localhost:3000',
				...headers
			}
		});

	it('is a 403 page that explains and links, with the other site’s name escaped', async () => {
		const res = refusal(post('/signin', { origin: 'http://a"<b>.test' }), ORIGIN);
		expect(res.status).toBe(403);
		expect(res.headers.get('content-type')).toContain('text/html');
		const html = await res.text();
		expect(html).toContain('<h1>Open the shop at its own address</h1>');
		expect(html).toContain('href="http://localhost:3000/signin"');
		expect(html).not.toContain('<b>');
		expect(html).toContain('&#60;b&#62;');
	});

	it('is JSON { error } under /api/', async () => {
		const res = refusal(post('/api/cart', { origin: 'http://127.0.0.1:3000' }), ORIGIN);
		expect(res.status).toBe(403);
		const body = (await res.json()) as { error: string; address: string };
		expect(body.error).toMatch(/sent from http:\/\/127\.0\.0\.1:3000/);
		expect(body.address).toBe('http://localhost:3000/api/cart');
	});

	it('is an action error result for use:enhance forms, which show it on the error page', async () => {
		const res = refusal(
			post('/cart?/quantity', {
				origin: 'null',
				'x-sveltekit-action': 'true',
				accept: 'application/json'
			}),
			ORIGIN
		);
		const body = (await res.json()) as { error: { message: string } };
		expect(body).toMatchObject({
			type: 'error',
			status: 403,
			error: { address: 'http://localhost:3000/cart' }
		});
		expect(body.error.message).toContain('a page we cannot name');
	});
});
