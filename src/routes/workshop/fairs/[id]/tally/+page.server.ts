import { z } from 'zod';
import { requireRole } from '$lib/server/auth/guard';
import { closeFair, saveTally } from '$lib/server/booth/tally';
import { tallyPage } from '$lib/server/booth/tally-page';
import { fairIdParam } from '$lib/server/fairs/fair-id';
import { orPageError } from '$lib/server/errors/page-answer';
import { orFail, runForm } from '$lib/server/errors/form-answer';
import { assertFairAccess } from '$lib/server/fairs/fair-helpers';
import { tallyFormInput } from '$lib/booth/tally-input';
import { parseForm } from '$lib/forms/parse-form';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'owner', 'helper');
	const id = fairIdParam(event.params.id);
	await orPageError(() => assertFairAccess(user, id));
	const day = event.url.searchParams.get('day');
	return orPageError(() => tallyPage(id, user.role === 'owner', day));
};

/** Closing ends the fair for every day and phone: it is asked for twice, on purpose. */
const closeConfirm = z.object({
	confirm: z.literal('yes', { error: 'Say yes to close the fair.' })
});

export const actions: Actions = {
	counts: async (event) => {
		const user = requireRole(event, 'owner', 'helper');
		const id = fairIdParam(event.params.id);
		const denied = await orFail(() => assertFairAccess(user, id));
		if (denied) return denied;
		const schema = tallyFormInput(user.role === 'owner');
		const save = (counted: z.output<typeof schema>) =>
			saveTally(id, counted, user).then(() => ({ saved: true }));
		return runForm(event.request, schema, save);
	},
	close: async (event) => {
		const user = requireRole(event, 'owner');
		const id = fairIdParam(event.params.id);
		const asked = await parseForm(event.request, closeConfirm, { extra: { askClose: true } });
		if (!asked.ok) return asked.failure;
		return orFail(() => closeFair(id, user.id).then(() => ({ closed: true })));
	}
};
