import { formFail, parseForm } from '$lib/forms/parse-form';
import { resetRequestSchema } from '$lib/auth/auth-schema';
import { requestPasswordReset } from '$lib/server/auth/reset-mail';
import { afterResponse } from '$lib/server/auth/after-response';
import { takeAll, tryAgainIn } from '$lib/server/http/rate-limit';
import { throttles } from '$lib/server/http/throttles';
import type { Actions } from './$types';

export const actions: Actions = {
	default: async (event) => {
		const parsed = await parseForm(event.request, resetRequestSchema);
		if (!parsed.ok) return parsed.failure;
		const { values } = parsed;
		const verdict = await takeAll([
			[throttles.resetEmail, parsed.data.email],
			[throttles.resetAddress, event.getClientAddress()]
		]);
		if (!verdict.ok) {
			event.locals.retryAfterS = verdict.retryAfterS;
			const wait = tryAgainIn(verdict.retryAfterS);
			return formFail(429, wait, { errors: { email: [wait] }, values });
		}
		// Looked up and mailed after answering: the same answer, in the same time, for everyone.
		afterResponse('password reset mail', () => requestPasswordReset(parsed.data.email));
		return { sent: true, email: parsed.data.email };
	}
};
