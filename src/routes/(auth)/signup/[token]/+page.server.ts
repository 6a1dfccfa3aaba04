import { redirect } from '@sveltejs/kit';
import { formFail } from '$lib/forms/parse-form';
import { checkSignUpToken, completeSignUp } from '$lib/server/auth/signup';
import { invalidateSession, signIn } from '$lib/server/auth/lucia';
import type { Actions, PageServerLoad } from './$types';

/** The token is in the address: keep it out of caches and out of any Referer header. */
const privateHeaders = { 'cache-control': 'no-store', 'referrer-policy': 'no-referrer' };

export const load: PageServerLoad = async ({ params, setHeaders }) => {
	setHeaders(privateHeaders);
	return { state: await checkSignUpToken(params.token) };
};

/** A POST (the button), not the GET: mail scanners that open links must not spend them. */
export const actions: Actions = {
	default: async ({ params, cookies, locals, url }) => {
		const done = await completeSignUp(params.token);
		if (!done.ok) {
			return formFail(400, 'This sign-up link can no longer be used.', { state: done.state });
		}
		if (locals.session) await invalidateSession(locals.session.id);
		await signIn(cookies, done.userId, url.protocol === 'https:');
		redirect(303, '/account');
	}
};
