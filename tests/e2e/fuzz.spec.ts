/**
 * Property-based: random strings and numbers at /api/pattern, /api/cart and the checkout form
 * never get a 500 (OWASP ASVS 4.0 V5.1: every input validated; 4xx with a message instead).
 * fast-check generates the inputs; a failing case is shrunk and printed with its seed.
 */
import fc from 'fast-check';
import { expect, test } from '@playwright/test';

const junk = fc.oneof(
	fc.string({ maxLength: 40 }),
	fc.string({ maxLength: 20, unit: 'binary' }),
	fc.integer().map(String),
	fc.double({ noNaN: false }).map(String),
	fc.constantFrom('', ' ', '0', '-1', '1e309', 'NaN', 'Infinity', '\u0000', '\u202e', '../', '%00')
);
const anyJson = fc.oneof(
	junk,
	fc.integer(),
	fc.double(),
	fc.boolean(),
	fc.constant(null),
	fc.array(junk, { maxLength: 3 })
);

test.describe.configure({ timeout: 120_000 });

test('GET /api/pattern never answers 500', async ({ request }) => {
	const keys = [
		'diameter',
		'count',
		'spacing',
		'split',
		'initials',
		'wood',
		'width',
		'length',
		'zzz'
	];
	await fc.assert(
		fc.asyncProperty(fc.dictionary(fc.constantFrom(...keys), junk, { maxKeys: 8 }), async (q) => {
			const res = await request.get(`/api/pattern?${new URLSearchParams(q)}`);
			expect(res.status(), JSON.stringify(q)).toBeLessThan(500);
			if (res.status() >= 400)
				expect(typeof ((await res.json()) as { error?: unknown }).error).toBe('string');
		}),
		{ numRuns: 120 }
	);
});

test('POST and PATCH /api/cart never answer 500', async ({ request, baseURL }) => {
	const keys = ['slug', 'wood', 'quantity', 'initials', 'style', 'lineId', 'country'];
	await fc.assert(
		fc.asyncProperty(
			fc.constantFrom('POST', 'PATCH', 'DELETE'),
			fc.oneof(fc.dictionary(fc.constantFrom(...keys), anyJson, { maxKeys: 6 }), anyJson),
			async (method, body) => {
				const res = await request.fetch('/api/cart', {
					method,
					headers: { 'content-type': 'application/json', origin: baseURL! },
					data: JSON.stringify(body)
				});
				expect(res.status(), `${method} ${JSON.stringify(body)}`).toBeLessThan(500);
			}
		),
		{ numRuns: 120 }
	);
});

test('the checkout form never answers 500', async ({ request, baseURL }) => {
	// A basket first, so the form gets past "your basket is empty" to the real checks.
	const add = await request.post('/api/cart', {
		headers: { 'content-type': 'application/json', origin: baseURL! },
		data: { slug: 'rosette-bottle-holder', wood: 'basswood', initials: 'FC' }
	});
	expect(add.status()).toBeLessThan(500);
	const keys = [
		'name',
		'email',
		'line1',
		'line2',
		'city',
		'region',
		'postcode',
		'country',
		'giftNote',
		'seenTotal'
	];
	await fc.assert(
		fc.asyncProperty(
			fc.dictionary(fc.constantFrom(...keys), junk, { maxKeys: 10 }),
			async (form) => {
				const res = await request.post('/checkout', {
					form,
					headers: { origin: baseURL!, accept: 'text/html' },
					maxRedirects: 0
				});
				expect(res.status(), JSON.stringify(form)).toBeLessThan(500);
			}
		),
		{ numRuns: 120 }
	);
});
