import { fail } from '@sveltejs/kit';
import { z } from 'zod';
import { resetRequestSchema } from '$lib/schemas/auth';
import { requestPasswordReset } from '$lib/server/auth/reset-mail';
import type { Actions } from './$types';

export const actions: Actions = {
	default: async ({ request }) => {
		const form = Object.fromEntries(await request.formData());
		const email = typeof form.email === 'string' ? form.email : '';
		const parsed = resetRequestSchema.safeParse(form);
		if (!parsed.success) {
			return fail(400, { errors: z.flattenError(parsed.error).fieldErrors, values: { email } });
		}
		try {
			await requestPasswordReset(parsed.data.email);
		} catch (err) {
			// Logged for the owner; the visitor gets the same answer as always, so a mail failure
			// does not reveal that the address has an account.
			console.error('password reset mail failed', err);
		}
		return { sent: true, email: parsed.data.email };
	}
};
