import { requireRole } from '$lib/server/auth/guard';
import { getFair, updateFair } from '$lib/server/fairs/fairs';
import { fairPage } from '$lib/server/booth/fair-page';
import { loadOut } from '$lib/server/fairs/load-out';
import { fairIdParam } from '$lib/server/fairs/fair-id';
import { orPageError } from '$lib/server/errors/page-answer';
import { orFail, runForm } from '$lib/server/errors/form-answer';
import { assertFairAccess, setFairHelpers } from '$lib/server/fairs/fair-helpers';
import { fairFormSchema, fairHelpersSchema, loadOutFormSchema } from '$lib/fairs/schemas';
import type { FairForm, LoadOutLine } from '$lib/fairs/schemas';
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
		const save = (f: FairForm) => updateFair(id, f).then(() => ({ saved: true }));
		return runForm(event.request, fairFormSchema, save, { form: 'save' });
	},
	helpers: async (event) => {
		requireRole(event, 'owner');
		const id = fairIdParam(event.params.id);
		const choose = ({ helper }: { helper: string[] }) =>
			setFairHelpers(id, helper).then(() => ({ helpersSaved: helper.length }));
		return runForm(event.request, fairHelpersSchema, choose, { form: 'helpers' }, (_, form) => ({
			helper: form.getAll('helper').filter((v) => typeof v === 'string')
		}));
	},
	loadOut: async (event) => {
		const user = requireRole(event, 'owner', 'helper');
		const id = fairIdParam(event.params.id);
		const denied = await orFail(() => assertFairAccess(user, id), { form: 'loadOut' });
		if (denied) return denied;
		const take = (lines: LoadOutLine[]) =>
			loadOut(id, lines, user.id).then(() => ({
				loaded: lines.reduce((a, l) => a + l.quantity, 0)
			}));
		return runForm(event.request, loadOutFormSchema, take, { form: 'loadOut' });
	}
};
