import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { fieldErrors, firstError, formValues, parseForm } from '$lib/forms/parse-form';
import { shopInfo } from '$lib/settings/settings-schema';
import { signInSchema } from '$lib/auth/auth-schema';

const post = (fields: [string, string][]) => {
	const f = new FormData();
	for (const [k, v] of fields) f.append(k, v);
	return f;
};

describe('the one form helper', () => {
	it('names flat fields as zod’s own flattenError does', () => {
		// Reference: zod's z.flattenError(...).fieldErrors, the library's own per-field grouping.
		const r = signInSchema.safeParse({ email: 'not an address', password: '' });
		expect(r.success).toBe(false);
		if (r.success) return;
		expect(fieldErrors(r.error)).toEqual(z.flattenError(r.error).fieldErrors);
	});

	it('names nested fields by their dotted input names and lists by the list field', () => {
		const r = shopInfo.safeParse({
			name: 'Shop',
			email: 'a@b.test',
			address: {
				name: '',
				line1: 'x',
				line2: '',
				city: '',
				region: '',
				postcode: 'p',
				country: 'US'
			}
		});
		expect(r.success).toBe(false);
		if (r.success) return;
		expect(Object.keys(fieldErrors(r.error)).sort()).toEqual(['address.city', 'address.name']);
		const list = z.object({ ids: z.array(z.number()) }).safeParse({ ids: [1, 'x'] });
		if (list.success) throw new Error('expected a refusal');
		expect(Object.keys(fieldErrors(list.error))).toEqual(['ids']);
		const whole = z
			.object({ a: z.string() })
			.refine(() => false, 'Nothing fits.')
			.safeParse({ a: '' });
		if (whole.success) throw new Error('expected a refusal');
		expect(fieldErrors(whole.error)).toEqual({ form: ['Nothing fits.'] });
	});

	it('answers 400 with errors and the values typed, never a password', async () => {
		const form = post([
			['email', 'nobody'],
			['password', 'hunter2hunter2']
		]);
		expect(formValues(form)).toEqual({ email: 'nobody' });
		const r = await parseForm(form, signInSchema);
		expect(r.ok).toBe(false);
		if (r.ok) return;
		expect(r.failure.status).toBe(400);
		expect(r.failure.data.values).toEqual({ email: 'nobody' });
		// The one fail shape: the first message as the sentence, every message by field.
		expect(r.failure.data.message).toBe(r.errors.email?.[0]);
		expect(r.failure.data.errors.email?.length).toBeGreaterThan(0);
		expect(firstError(r.errors)).toBe(r.errors.email?.[0]);
	});

	it('hands back the parsed data when the form is good', async () => {
		const r = await parseForm(
			post([
				['email', 'Hollis@Example.test'],
				['password', 'long enough password']
			]),
			signInSchema
		);
		expect(r.ok).toBe(true);
		if (r.ok) expect(r.data.email.toLowerCase()).toBe('hollis@example.test');
	});
});
