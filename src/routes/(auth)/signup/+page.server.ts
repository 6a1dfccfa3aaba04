import { fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { signUpSchema } from '$lib/schemas/auth';
import { safeNext } from '$lib/safe-redirect';
import { afterResponse } from '$lib/server/auth/after-response';
import { requestSignUp } from '$lib/server/auth/signup';
import { takeAll, tryAgainIn } from '$lib/server/rate-limit';
import { throttles } from '$lib/server/throttles';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, url }) => {
	const next = safeNext(url.searchParams.get('next'), '', url.origin);
	if (locals.user) redirect(303, next || '/account');
	return { next };
};

const text = (v: FormDataEntryValue | undefined) => (typeof v === 'string' ? v : '');

/**
 * Sign-up answers "check your e-mail" for every well-formed request, at once: the account is
 * made from the e-mailed link, and a known address gets a note to its owner instead, so the
 * form does not reveal who has an account.
 */
export const actions: Actions = {
	default: async (event) => {
		const form = Object.fromEntries(await event.request.formData());
		const values = { name: text(form.name), email: text(form.email) };
		const parsed = signUpSchema.safeParse(form);
		if (!parsed.success) {
			return fail(400, { errors: z.flattenError(parsed.error).fieldErrors, values });
		}
		const verdict = await takeAll([
			[throttles.signUpEmail, parsed.data.email],
			[throttles.signUpAddress, event.getClientAddress()]
		]);
		if (!verdict.ok) {
			event.locals.retryAfterS = verdict.retryAfterS;
			return fail(429, { errors: { form: [tryAgainIn(verdict.retryAfterS)] }, values });
		}
		// Sign-up only ever makes customers; staff are added by the owner in the workshop.
		const { name, email, password } = parsed.data;
		afterResponse('sign-up mail', () => requestSignUp({ name, email, password }));
		return { sent: true, email };
	}
};
