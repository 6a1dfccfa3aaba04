import { redirect } from '@sveltejs/kit';
import { formFail, parseForm } from '$lib/forms/parse-form';
import { signUpSchema } from '$lib/auth/auth-schema';
import { safeNext } from '$lib/auth/safe-redirect';
import { afterResponse } from '$lib/server/auth/after-response';
import { requestSignUp } from '$lib/server/auth/signup';
import { takeAll, tryAgainIn } from '$lib/server/http/rate-limit';
import { throttles } from '$lib/server/http/throttles';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, url }) => {
	const next = safeNext(url.searchParams.get('next'), '', url.origin);
	if (locals.user) redirect(303, next || '/account');
	return { next };
};

/**
 * Sign-up answers "check your e-mail" for every well-formed request, at once: the account is
 * made from the e-mailed link, and a known address gets a note to its owner instead, so the
 * form does not reveal who has an account.
 */
export const actions: Actions = {
	default: async (event) => {
		const parsed = await parseForm(event.request, signUpSchema);
		if (!parsed.ok) return parsed.failure;
		const { values } = parsed;
		const verdict = await takeAll([
			[throttles.signUpEmail, parsed.data.email],
			[throttles.signUpAddress, event.getClientAddress()]
		]);
		if (!verdict.ok) {
			event.locals.retryAfterS = verdict.retryAfterS;
			return formFail(429, tryAgainIn(verdict.retryAfterS), { values });
		}
		// Sign-up only ever makes customers; staff are added by the owner in the workshop.
		const { name, email, password } = parsed.data;
		afterResponse('sign-up mail', () => requestSignUp({ name, email, password }));
		return { sent: true, email };
	}
};
