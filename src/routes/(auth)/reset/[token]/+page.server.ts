import { redirect } from '@sveltejs/kit';
import { formFail, parseForm } from '$lib/forms/parse-form';
import { resetPasswordSchema } from '$lib/auth/auth-schema';
import { homeFor } from '$lib/auth/safe-redirect';
import { checkResetToken, completeReset } from '$lib/server/auth/reset';
import { signIn } from '$lib/server/auth/lucia';
import { findUserById } from '$lib/server/auth/users';
import type { Actions, PageServerLoad } from './$types';

/** The token is in the address: keep it out of caches and out of any Referer header. */
const privateHeaders = { 'cache-control': 'no-store', 'referrer-policy': 'no-referrer' };

export const load: PageServerLoad = async ({ params, setHeaders }) => {
	setHeaders(privateHeaders);
	return { state: await checkResetToken(params.token) };
};

export const actions: Actions = {
	default: async ({ params, request, cookies, url }) => {
		const parsed = await parseForm(request, resetPasswordSchema, {
			extra: { state: 'valid' as const }
		});
		if (!parsed.ok) return parsed.failure;
		const done = await completeReset(params.token, parsed.data.password);
		if (!done.ok) {
			return formFail(400, 'This reset link can no longer be used.', {
				errors: {},
				state: done.state
			});
		}

		// completeReset ended every older session of the account; this one starts fresh.
		await signIn(cookies, done.userId, url.protocol === 'https:');
		const user = await findUserById(done.userId);
		redirect(303, user ? homeFor(user.role) : '/');
	}
};
