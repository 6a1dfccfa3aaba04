import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { safeNext } from '$lib/auth/safe-redirect';
import {
	addHelperSchema,
	resetPasswordSchema,
	signInSchema,
	signUpSchema
} from '$lib/auth/auth-schema';

describe('safeNext', () => {
	it('keeps a path on this site, with its query and fragment', () => {
		expect(safeNext('/workshop/orders?status=paid#top')).toBe('/workshop/orders?status=paid#top');
		expect(safeNext('/account')).toBe('/account');
	});

	it('falls back for anything that could leave the site', () => {
		for (const bad of [
			'https://elsewhere.example/',
			'//elsewhere.example/path',
			'/\\elsewhere.example',
			'javascript:alert(1)',
			'workshop',
			'/\t/elsewhere.example',
			'',
			null,
			undefined
		]) {
			expect(safeNext(bad, '/fallback')).toBe('/fallback');
		}
	});
});

const fields = (r: {
	success: boolean;
	error?: z.ZodError;
}): Record<string, string[] | undefined> => (r.error ? z.flattenError(r.error).fieldErrors : {});

describe('auth form schemas', () => {
	it('normalises the e-mail and accepts any non-empty password to sign in', () => {
		const r = signInSchema.safeParse({ email: '  Juniper@Example.TEST ', password: 'short' });
		expect(r.success && r.data).toEqual({ email: 'juniper@example.test', password: 'short' });
	});

	it('sign-up wants a name, an e-mail, 10+ characters and the same password twice', () => {
		const r = signUpSchema.safeParse({
			name: ' ',
			email: 'nope',
			password: 'short',
			confirm: 'other'
		});
		const f = fields(r);
		expect(f.name?.[0]).toBe('Tell us your name.');
		expect(f.email?.[0]).toBe('That does not look like an e-mail address.');
		expect(f.password?.[0]).toBe('Use at least 10 characters.');

		const mismatch = signUpSchema.safeParse({
			name: 'Juniper',
			email: 'j@example.test',
			password: 'long enough 1',
			confirm: 'long enough 2'
		});
		expect(fields(mismatch).confirm?.[0]).toBe('The two passwords are not the same.');
		expect(
			signUpSchema.safeParse({
				name: 'Juniper',
				email: 'j@example.test',
				password: 'long enough 1',
				confirm: 'long enough 1'
			}).success
		).toBe(true);
	});

	it('reset and add-helper reuse the same password rule', () => {
		expect(
			fields(resetPasswordSchema.safeParse({ password: 'x', confirm: 'x' })).password?.[0]
		).toBe('Use at least 10 characters.');
		expect(
			fields(addHelperSchema.safeParse({ name: 'W', email: 'w@example.test', password: 'short' }))
				.password?.[0]
		).toBe('Use at least 10 characters.');
	});

	it('reports a missing field instead of throwing', () => {
		expect(fields(signInSchema.safeParse({})).email?.[0]).toBe('Enter your e-mail address.');
	});
});
