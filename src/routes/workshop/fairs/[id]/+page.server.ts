import { fail } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import { getFair, updateFair } from '$lib/server/fairs/fairs';
import { fairPage } from '$lib/server/fairs/fair-page';
import { loadOut } from '$lib/server/fairs/load-out';
import { fairIdParam, orFail, orPageError } from '$lib/server/booth/http';
import { assertFairAccess, setFairHelpers } from '$lib/server/fairs/fair-helpers';
import { fairFormSchema } from '$lib/fairs/schemas';
import { loadOutLines } from '$lib/fairs/load-out-form';
import { formTexts, parseForm } from '$lib/forms/parse-form';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'owner', 'helper');
	const id = fairIdParam(event.params.id);
	const fair = await orPageError(() => getFair(id));
	await orPageError(() => assertFairAccess(user, id));
	return fairPage(fair, user.role);
};

export const actions: Actions = {
	save: async (event) => {
		requireRole(event, 'owner');
		const id = fairIdParam(event.params.id);
		const parsed = await parseForm(event.request, fairFormSchema);
		if (!parsed.ok) return parsed.failure;
		return orFail(async () => {
			await updateFair(id, parsed.data);
			return { saved: true };
		});
	},
	helpers: async (event) => {
		requireRole(event, 'owner');
		const id = fairIdParam(event.params.id);
		const chosen = (await event.request.formData())
			.getAll('helper')
			.filter((v): v is string => typeof v === 'string');
		return orFail(async () => {
			await setFairHelpers(id, chosen);
			return { helpersSaved: chosen.length };
		});
	},
	loadOut: async (event) => {
		const user = requireRole(event, 'owner', 'helper');
		const id = fairIdParam(event.params.id);
		const denied = await orFail(() => assertFairAccess(user, id));
		if (denied) return denied;
		const read = loadOutLines(formTexts(await event.request.formData()));
		if ('error' in read) return fail(400, { loadOutError: read.error, key: read.key });
		const { lines } = read;
		return orFail(async () => {
			await loadOut(id, lines, user.id);
			return { loaded: lines.reduce((a, l) => a + l.quantity, 0) };
		});
	}
};
