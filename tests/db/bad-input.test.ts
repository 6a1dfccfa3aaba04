/**
 * Bad input answers 4xx with a plain message, never 500. Sources: OWASP ASVS 4.0 V5.1 (input
 * validation: allowed characters, lengths), RFC 9110 §15.5.14 (413 Content Too Large), the Unicode
 * bidirectional "Trojan Source" characters (CVE-2021-42574, U+202A–U+202E, U+2066–U+2069).
 */
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { checkoutSchema } from '$lib/cart/checkout-schema';
import { signInSchema, signUpSchema } from '$lib/auth/auth-schema';
import { addLineSchema } from '$lib/cart/cart-schema';
import { HIDDEN_CHARACTERS_MESSAGE } from '$lib/forms/plain-text';
import { getPiece } from '$lib/server/catalogue/catalogue';
import { MAX_PATTERN_WORK, patternJson, patternWork } from '$lib/server/pattern/api';
import { patternQuerySchema } from '$lib/pattern/pattern-schema';

const address = {
	name: 'Ada Linden',
	email: 'ada@example.test',
	line1: '4 Mill Lane',
	city: 'Linden Ford',
	region: 'CO',
	postcode: '80302',
	country: 'US'
};
const errorsOf = (r: { error?: z.ZodError }): Record<string, string[] | undefined> =>
	r.error ? z.flattenError(r.error).fieldErrors : {};

describe('hidden characters in free text are refused with a message (ASVS V5.1.4)', () => {
	const hidden = {
		'right-to-left override U+202E': 'Ada \u202Enednil',
		'left-to-right isolate U+2066': 'Ada \u2066Linden\u2069',
		NUL: 'Ada\u0000Linden',
		'escape (C0)': 'Ada\u001b[31mLinden',
		'C1 control U+0085': 'Ada\u0085Linden',
		'line break in a one-line field': 'Ada\nBcc: all@example.test'
	};
	for (const [what, value] of Object.entries(hidden)) {
		it(`name, address line and city refuse ${what}`, () => {
			for (const field of ['name', 'line1', 'city'] as const) {
				const r = checkoutSchema.safeParse({ ...address, [field]: value });
				expect(r.success).toBe(false);
				expect(errorsOf(r)[field]).toContain(HIDDEN_CHARACTERS_MESSAGE);
			}
			const s = signUpSchema.safeParse({
				name: value,
				email: 'a@example.test',
				password: 'long enough 1',
				confirm: 'long enough 1'
			});
			expect(errorsOf(s).name).toContain(HIDDEN_CHARACTERS_MESSAGE);
		});
	}

	it('a gift note keeps its line breaks but not a bidi override', () => {
		expect(
			checkoutSchema.safeParse({ ...address, giftNote: 'Happy birthday,\nlove Fern' }).success
		).toBe(true);
		const r = checkoutSchema.safeParse({ ...address, giftNote: 'Happy \u202Eyadhtrib' });
		expect(errorsOf(r).giftNote).toContain(HIDDEN_CHARACTERS_MESSAGE);
	});

	it('ordinary accented names and addresses still pass', () => {
		expect(checkoutSchema.safeParse({ ...address, name: 'Zoë Ó Briain-Müller' }).success).toBe(
			true
		);
	});
});

describe('passwords and slugs', () => {
	it('a 10 KB password says it is too long, not "Enter your password."', () => {
		const r = signInSchema.safeParse({ email: 'a@example.test', password: 'x'.repeat(10_000) });
		expect(errorsOf(r).password?.[0]).toMatch(/at most 200 characters/);
	});

	it('a slug with a NUL byte is not a piece, even though the collation would match it', async () => {
		expect(await getPiece('rosette-bottle-holder')).not.toBeNull();
		expect(await getPiece('rosette-bottle-holder\u0000')).toBeNull();
		expect(await getPiece('rosette-bottle-holder ')).toBeNull();
		const r = addLineSchema.safeParse({ slug: 'rosette-bottle-holder\u0000', wood: 'basswood' });
		expect(errorsOf(r).slug?.[0]).toBe('Pick a piece from the shop.');
	});
});

describe('photos: long and unknown keys are 404', () => {
	it('a 5,000-character key answers 404, not 500', async () => {
		const { GET } = await import('../../src/routes/photos/[...key]/+server');
		const key = `pieces/${'a'.repeat(5000)}/640.webp`;
		await expect(
			GET({ params: { key }, request: new Request('http://x/') } as unknown as Parameters<
				typeof GET
			>[0])
		).rejects.toMatchObject({ status: 404 });
	});
});

describe('JSON bodies: 413 past the limit (RFC 9110 §15.5.14)', () => {
	const call = async (body: BodyInit, headers: Record<string, string> = {}) => {
		const { POST } = await import('../../src/routes/api/cart/+server');
		const request = new Request('http://x/api/cart', {
			method: 'POST',
			body,
			headers: { 'content-type': 'application/json', ...headers },
			// @ts-expect-error Node's fetch wants this for a streamed body
			duplex: 'half'
		});
		return POST({
			request,
			cookies: { get: () => undefined, set: () => undefined },
			locals: { user: null },
			url: new URL('http://x/api/cart')
		} as unknown as Parameters<typeof POST>[0]);
	};

	it('a 20 MB body streamed without a length answers 413 with a plain message', async () => {
		const chunk = new Uint8Array(1024 * 1024).fill(0x20);
		let sent = 0;
		const stream = new ReadableStream<Uint8Array>({
			pull(c) {
				if (sent++ < 20) c.enqueue(chunk);
				else c.close();
			}
		});
		const res = await call(stream);
		expect(res.status).toBe(413);
		expect(((await res.json()) as { error: string }).error).toMatch(/too large/);
	});

	it('a small body that is not an object is still 400 "Send a JSON object."', async () => {
		const res = await call('[1,2]');
		expect(res.status).toBe(400);
		expect(await res.json()).toEqual({ error: 'Send a JSON object.' });
	});
});

describe('pattern API: bounded work and a cache keyed by the normalised query', () => {
	const q = (s: string) => patternQuerySchema.parse(Object.fromEntries(new URLSearchParams(s)));

	it('the work estimate is never below the chips the engine actually draws', () => {
		let drawn = 0;
		for (const d of [20, 60, 150])
			for (const count of [2, 4, 6])
				for (const f of [0.1, 0.5, 1])
					for (const split of [0, 1]) {
						const s = `diameter=${d}&count=${count}&width=1000&length=2000&split=${split}&spacing=${Math.max(5, d * f)}`;
						const { status, text } = patternJson(new URLSearchParams(s), null);
						if (status !== 200) continue;
						drawn++;
						expect(patternWork(q(s)), s).toBeGreaterThanOrEqual(
							(JSON.parse(text) as { chipCount: number }).chipCount
						);
					}
		expect(drawn).toBeGreaterThan(30);
	});

	it('a valid but heavy layout gets a 400 that says what to change', () => {
		const heavy = 'diameter=300&count=12&width=1000&length=2000&split=1&spacing=30';
		expect(patternWork(q(heavy))).toBeGreaterThan(MAX_PATTERN_WORK);
		const { status, text } = patternJson(new URLSearchParams(heavy), null);
		expect(status).toBe(400);
		expect((JSON.parse(text) as { error: string }).error).toMatch(/too large.*fewer rosettes/);
	});

	it('the same layout asked differently is one cache entry', () => {
		const a = patternJson(new URLSearchParams('diameter=72&count=2&width=120&length=300'), null);
		const b = patternJson(new URLSearchParams('length=300&width=120.0&count=2&diameter=072'), null);
		expect(a.cached).toBe(false);
		expect(b.cached).toBe(true);
		expect(b.text).toBe(a.text);
	});
});
