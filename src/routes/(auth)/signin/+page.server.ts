import { redirect } from '@sveltejs/kit';
import { formFail, formText, parseForm } from '$lib/forms/parse-form';
import { signInSchema } from '$lib/auth/auth-schema';
import { homeFor, safeNext } from '$lib/auth/safe-redirect';
import { authenticate } from '$lib/server/auth/users';
import { invalidateSession, signIn } from '$lib/server/auth/lucia';
import { tryAgainIn } from '$lib/server/http/rate-limit';
import {
	DEVICE_COOKIE,
	signInGate,
	signInSucceeded,
	trustDevice
} from '$lib/server/auth/sign-in-throttle';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, url }) => {
	const next = safeNext(url.searchParams.get('next'), '', url.origin);
	if (locals.user) redirect(303, next || homeFor(locals.user.role));
	return { next };
};

/** The same words whether the e-mail or the password was wrong. */
const NO_MATCH = "That e-mail and password don't match an account.";

export const actions: Actions = {
	default: async (event) => {
		const { request, cookies, locals, url } = event;
		const parsed = await parseForm(request, signInSchema);
		if (!parsed.ok) return parsed.failure;
		const { form, values } = parsed;
		const next = safeNext(
			formText(form.get('next'), url.searchParams.get('next') ?? ''),
			'',
			url.origin
		);
		// Every attempt counts before the password is checked; see sign-in-throttle for how.
		const address = event.getClientAddress();
		const verdict = await signInGate(
			parsed.data.email,
			address,
			cookies.get(DEVICE_COOKIE),
			url.origin
		);
		if (!verdict.ok) {
			locals.retryAfterS = verdict.retryAfterS;
			return formFail(429, tryAgainIn(verdict.retryAfterS), { values });
		}
		const user = await authenticate(parsed.data.email, parsed.data.password);
		if (!user) return formFail(400, NO_MATCH, { values });

		await signInSucceeded(parsed.data.email, address);
		if (locals.session) await invalidateSession(locals.session.id);
		await signIn(cookies, user.id, url.protocol === 'https:');
		trustDevice(cookies, user.email, url.protocol === 'https:');
		redirect(303, next || homeFor(user.role));
	}
};
