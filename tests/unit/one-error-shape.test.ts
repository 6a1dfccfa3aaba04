/**
 * One error type, one answer shape per kind of route, one JSON reader: the rules DEVELOPERS.md
 * states about refusals, kept by reading the source tree and by calling the adapters. The shapes
 * are SvelteKit's own (`fail(status, data)` for a form action, `error(status, message)` for a
 * page, a JSON body with the status for an API route: kit.svelte.dev "Form actions" and
 * "Errors"); the statuses are RFC 9110's (400, 404, 409, 413).
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { isActionFailure, isHttpError } from '@sveltejs/kit';
import { z } from 'zod';
import { describe, expect, it } from 'vitest';
import { DomainError } from '$lib/server/errors/domain-error';
import { failFrom, orFail, runForm } from '$lib/server/errors/form-answer';
import { orPageError } from '$lib/server/errors/page-answer';
import { orApiError } from '$lib/server/http/api-errors';
import { formFail, parseForm } from '$lib/forms/parse-form';

const ROOT = path.resolve(import.meta.dirname, '../..');
const rel = (p: string) => path.relative(ROOT, p).split(path.sep).join('/');
function files(dir: string): string[] {
	return readdirSync(dir).flatMap((n) => {
		const p = path.join(dir, n);
		return statSync(p).isDirectory() ? files(p) : /\.(ts|svelte)$/.test(n) ? [p] : [];
	});
}
const src = files(path.join(ROOT, 'src')).map((f) => ({
	path: rel(f),
	text: readFileSync(f, 'utf8')
}));
const routes = src.filter((f) => f.path.startsWith('src/routes/') && f.path.endsWith('.ts'));
const where = (pattern: RegExp, among = src) =>
	among.filter((f) => pattern.test(f.text)).map((f) => f.path);

describe('the rules, kept by reading the source', () => {
	it('DomainError is the only error class of the domain', () => {
		expect(where(/class \w+ extends Error\b/)).toEqual(['src/lib/server/errors/domain-error.ts']);
	});

	it('no route builds a failure by hand: it goes through parseForm, formFail or the adapters', () => {
		// `fail` from '@sveltejs/kit' appears in no route file; formFail makes every failure.
		expect(where(/import\s*\{[^}]*\bfail\b[^}]*\}\s*from\s*'@sveltejs\/kit'/, routes)).toEqual([]);
		expect(where(/(?<![\w.])fail\(/, routes)).toEqual([]);
	});

	it('every form action reads its form through parseForm (never request.formData itself)', () => {
		const actionFiles = routes.filter((f) => !f.path.endsWith('+server.ts'));
		expect(actionFiles.length).toBeGreaterThan(15);
		expect(where(/\.formData\(\)/, actionFiles)).toEqual([]);
	});

	it('every JSON route reads its body through readJson; only the webhook reads raw text', () => {
		const servers = routes.filter((f) => f.path.endsWith('+server.ts'));
		expect(where(/request\.json\(\)/, servers)).toEqual([]);
		expect(where(/request\.text\(\)/, servers)).toEqual([
			'src/routes/api/payments/webhook/+server.ts'
		]);
		const readers = where(
			/JSON\.parse\(/,
			src.filter((f) => f.path.startsWith('src/lib/server/http/'))
		);
		expect(readers).toEqual(['src/lib/server/http/read-json.ts']);
	});

	it('no route maps a domain refusal to a status by hand (the adapters do)', () => {
		expect(where(/err(or)?\.status\s*(===|!==|\?)/, routes)).toEqual([]);
	});
});

describe('the adapters', () => {
	const refused = new DomainError(409, 'Order LF-1 is already “Packed”; nothing was changed.');
	const onField = new DomainError(400, 'Only 2 ready now.', {
		fields: { quantity: ['Only 2 ready now.'] }
	});

	it('a form action answers fail(status, { message, errors, ...more })', async () => {
		const f = failFrom(refused, { form: 'move' });
		expect(f.status).toBe(409);
		expect(f.data).toEqual({
			form: 'move',
			message: refused.message,
			errors: { form: [refused.message] }
		});
		const g: unknown = await orFail(() => Promise.reject(onField), { values: { quantity: '3' } });
		expect(isActionFailure(g)).toBe(true);
		if (!isActionFailure(g)) return;
		expect(g.status).toBe(400);
		expect(g.data).toEqual({
			message: 'Only 2 ready now.',
			errors: { quantity: ['Only 2 ready now.'] },
			values: { quantity: '3' }
		});
	});

	it('bad input and a refusal have the same shape; other errors are faults, thrown on', async () => {
		const post = (fields: Record<string, string>) => {
			const form = new FormData();
			for (const [k, v] of Object.entries(fields)) form.set(k, v);
			return new Request('http://x/', { method: 'POST', body: form });
		};
		const schema = z.object({ count: z.coerce.number().int('Type a whole number.') });
		const bad = await runForm(post({ count: '1.5' }), schema, () => Promise.resolve('never'), {
			form: 'c'
		});
		expect(isActionFailure(bad) && bad.data).toEqual({
			form: 'c',
			message: 'Type a whole number.',
			errors: { count: ['Type a whole number.'] },
			values: { count: '1.5' }
		});
		const parsed = await parseForm(post({ count: '1.5' }), schema);
		expect(!parsed.ok && Object.keys(parsed.failure.data).sort()).toEqual(
			Object.keys(formFail(400, 'x', { errors: {}, values: {} }).data).sort()
		);
		const good = await runForm(post({ count: '4' }), schema, (d) =>
			Promise.resolve({ twice: d.count * 2 })
		);
		expect(good).toEqual({ twice: 8 });
		await expect(orFail(() => Promise.reject(new TypeError('bug')))).rejects.toThrow(TypeError);
	});

	it('a page load answers error(status, message)', async () => {
		const thrown = await orPageError(() => Promise.reject(refused)).catch((e: unknown) => e);
		expect(isHttpError(thrown)).toBe(true);
		if (isHttpError(thrown))
			expect([thrown.status, thrown.body.message]).toEqual([409, refused.message]);
	});

	it('a JSON route answers { error, fields? } with the status', async () => {
		const a = await orApiError(() => Promise.reject(onField));
		expect(a.status).toBe(400);
		expect(await a.json()).toEqual({
			error: 'Only 2 ready now.',
			fields: { quantity: ['Only 2 ready now.'] }
		});
		const b = await orApiError(() => Promise.reject(refused));
		expect([b.status, await b.json()]).toEqual([409, { error: refused.message }]);
		await expect(orApiError(() => Promise.reject(new RangeError('bug')))).rejects.toThrow(
			RangeError
		);
	});
});
