import { fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { signUpSchema } from '$lib/schemas/auth';
import { safeNext } from '$lib/safe-redirect';
import { createAccount } from '$lib/server/auth/users';
import { invalidateSession, signIn } from '$lib/server/auth/lucia';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, url }) => {
	const next = safeNext(url.searchParams.get('next'), '');
	if (locals.user) redirect(303, next || '/account');
	return { next };
};

const text = (v: FormDataEntryValue | undefined) => (typeof v === 'string' ? v : '');

export const actions: Actions = {
	default: async ({ request, cookies, locals, url }) => {
		const form = Object.fromEntries(await request.formData());
		const values = { name: text(form.name), email: text(form.email) };
		const next = safeNext(text(form.next) || url.searchParams.get('next'), '');
		const parsed = signUpSchema.safeParse(form);
		if (!parsed.success) {
			return fail(400, { errors: z.flattenError(parsed.error).fieldErrors, values });
		}
		// Sign-up only ever makes customers; staff are added by the owner in the workshop.
		const created = await createAccount({ ...parsed.data, role: 'customer' });
		if (!created.ok) {
			return fail(400, {
				errors: {
					email: ['An account with this e-mail already exists. Sign in, or reset its password.']
				},
				values
			});
		}
		if (locals.session) await invalidateSession(locals.session.id);
		await signIn(cookies, created.user.id);
		redirect(303, next || '/account');
	}
};
