import { fail } from '@sveltejs/kit';
import { z } from 'zod';
import { resetRequestSchema } from '$lib/schemas/auth';
import { requestPasswordReset } from '$lib/server/auth/reset-mail';
import { afterResponse } from '$lib/server/auth/after-response';
import { takeAll, tryAgainIn } from '$lib/server/rate-limit';
import { throttles } from '$lib/server/throttles';
import type { Actions } from './$types';

export const actions: Actions = {
	default: async (event) => {
		const form = Object.fromEntries(await event.request.formData());
		const email = typeof form.email === 'string' ? form.email : '';
		const parsed = resetRequestSchema.safeParse(form);
		if (!parsed.success) {
			return fail(400, { errors: z.flattenError(parsed.error).fieldErrors, values: { email } });
		}
		const verdict = await takeAll([
			[throttles.resetEmail, parsed.data.email],
			[throttles.resetAddress, event.getClientAddress()]
		]);
		if (!verdict.ok) {
			event.locals.retryAfterS = verdict.retryAfterS;
			return fail(429, {
				errors: { email: [tryAgainIn(verdict.retryAfterS)] },
				values: { email }
			});
		}
		// Looked up and mailed after answering: the same answer, in the same time, for everyone.
		afterResponse('password reset mail', () => requestPasswordReset(parsed.data.email));
		return { sent: true, email: parsed.data.email };
	}
};
