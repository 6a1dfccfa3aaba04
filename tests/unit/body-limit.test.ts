/**
 * Each kind of body has its own cap, and an answer given before a body is read leaves the
 * connection usable. Sources: RFC 9110 §15.5.14 (413 Content Too Large), RFC 9112 §9.6 (a server
 * that will not read the rest closes the connection), the 12 MB the upload page promises
 * ($lib/catalogue/photo-limits) and the booth route's 2 MB. The raw-socket walk is in
 * tests/e2e/journeys/forms.spec.ts.
 */
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import {
	API_BODY_LIMIT,
	DRAIN_LIMIT,
	TOO_LARGE,
	bodyLimitFor,
	settleUnreadBody
} from '$lib/server/http/body-limit';
import { NOT_A_JSON_OBJECT, readJson } from '$lib/server/http/read-json';
import { DomainError } from '$lib/server/errors/domain-error';
import { MAX_PHOTO_BYTES } from '$lib/catalogue/photo-limits';
import { plainMessage } from '$lib/forms/plain-messages';

const MB = 1024 * 1024;

describe('the cap by route and content type', () => {
	it('JSON under /api/ is 64 KB', () => {
		expect(bodyLimitFor('/api/cart', 'application/json').bytes).toBe(64 * 1024);
		expect(bodyLimitFor('/api/payments/webhook', null).bytes).toBe(API_BODY_LIMIT);
	});
	it('a multipart photo upload is the promised 12 MB plus a small envelope, not 64 KB', () => {
		const limit = bodyLimitFor('/api/uploads', 'multipart/form-data; boundary=----x');
		expect(limit.bytes).toBeGreaterThanOrEqual(12 * MB);
		expect(limit.bytes).toBeLessThan(12 * MB + MB);
		expect(limit.bytes).toBeGreaterThan(MAX_PHOTO_BYTES);
		expect(limit.message).toMatch(/at most 12 MB/);
	});
	it('the booth sync takes 2 MB whatever its type says', () => {
		expect(bodyLimitFor('/api/booth/7/sales', 'application/json').bytes).toBe(2_000_000);
		expect(bodyLimitFor('/api/booth/7/orders', 'text/plain').bytes).toBe(2_000_000);
		expect(bodyLimitFor('/api/booth/7/sales/extra', 'application/json').bytes).toBe(API_BODY_LIMIT);
	});
});

const streamOf = (bytes: number) => {
	let left = bytes;
	return new ReadableStream<Uint8Array>({
		pull(c) {
			if (left <= 0) return c.close();
			const n = Math.min(left, 64 * 1024);
			left -= n;
			c.enqueue(new Uint8Array(n));
		}
	});
};
const post = (bytes: number, declared = bytes) =>
	new Request('http://localhost/api/uploads', {
		method: 'POST',
		body: streamOf(bytes),
		headers: { 'content-length': String(declared) },
		duplex: 'half'
	} as RequestInit);

describe('an answer given before the body was read', () => {
	it('reads the rest of a small body away and keeps the connection', async () => {
		const request = post(3 * MB);
		const response = new Response('{}', { status: 401 });
		await settleUnreadBody(request, response);
		expect(request.bodyUsed).toBe(true);
		expect(response.headers.get('connection')).toBeNull();
	});
	it('closes the connection rather than read a body past the drain limit', async () => {
		const request = post(1024, DRAIN_LIMIT + 1);
		const response = new Response('{}', { status: 413 });
		await settleUnreadBody(request, response);
		expect(response.headers.get('connection')).toBe('close');
	});
	it('leaves a body the route read alone', async () => {
		const request = post(10);
		await request.arrayBuffer();
		const response = new Response('{}');
		await settleUnreadBody(request, response);
		expect(response.headers.get('connection')).toBeNull();
	});
	it('a JSON body over its cap is refused with 413 after reading it through', async () => {
		// Declared small, sent large: only counting the bytes as they arrive catches it.
		const request = post(200 * 1024, 1000);
		const err = await readJson(request).catch((e: unknown) => e);
		expect(err).toBeInstanceOf(DomainError);
		expect([(err as DomainError).status, (err as DomainError).message]).toEqual([413, TOO_LARGE]);
	});
	it('a body that is not a JSON object is a 400 with one sentence, whatever is wrong', async () => {
		for (const body of ['{"a":', '[1,2]', '"text"', 'null', '']) {
			const request = new Request('http://localhost/api/cart', {
				method: 'POST',
				body,
				headers: { 'content-type': 'application/json' }
			});
			const err = await readJson(request).catch((e: unknown) => e);
			expect(err, body).toBeInstanceOf(DomainError);
			expect([(err as DomainError).status, (err as DomainError).message]).toEqual([
				400,
				NOT_A_JSON_OBJECT
			]);
		}
	});
	it('reads a JSON object as it was sent', async () => {
		const request = new Request('http://localhost/api/cart', {
			method: 'POST',
			body: '{"slug":"x","quantity":2}',
			headers: { 'content-type': 'application/json' }
		});
		expect(await readJson(request)).toEqual({ slug: 'x', quantity: 2 });
	});
});

describe('plain sentences for checks without a message of their own', () => {
	z.config({ customError: plainMessage });
	const first = (schema: z.ZodType, v: unknown) => schema.safeParse(v).error?.issues[0].message;
	it('says how long a text may be, and asks for an empty one', () => {
		expect(first(z.string().max(120), 'x'.repeat(121))).toBe('Keep it to 120 characters or fewer.');
		expect(first(z.string().min(1), '')).toBe('Fill this in.');
		expect(first(z.object({ a: z.string() }), {})).toBe('Fill this in.');
	});
	it('keeps a message the schema wrote itself', () => {
		expect(first(z.string().max(3, 'At most three initials.'), 'ABCD')).toBe(
			'At most three initials.'
		);
	});
	it('numbers, e-mail addresses and choices', () => {
		expect(first(z.number().max(365), 400)).toBe('Use a number of at most 365.');
		expect(first(z.email(), 'nope')).toBe('Type an e-mail address, like name@example.com.');
		expect(first(z.enum(['a', 'b']), 'c')).toBe('Choose one of the options offered.');
	});
});
