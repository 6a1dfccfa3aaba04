import { requireRole } from '$lib/server/auth/guard';
import { fairPieces, getFair, updateFair } from '$lib/server/fairs/fairs';
import { loadOut, workshopShelf } from '$lib/server/fairs/load-out';
import { fairHistory } from '$lib/server/booth/void';
import { fairIdParam } from '$lib/server/fairs/fair-id';
import { orPageError } from '$lib/server/errors/page-answer';
import { orFail, runForm } from '$lib/server/errors/form-answer';
import {
	assertFairAccess,
	fairHelperChoices,
	setFairHelpers
} from '$lib/server/fairs/fair-helpers';
import { fairFormSchema, fairHelpersSchema, loadOutFormSchema } from '$lib/fairs/schemas';
import type { FairForm, LoadOutLine } from '$lib/fairs/schemas';
import { fairFormValues } from '$lib/fairs/form-values';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'owner', 'helper');
	const id = fairIdParam(event.params.id);
	const fair = await orPageError(() => getFair(id));
	await orPageError(() => assertFairAccess(user, id));
	const pieces = await fairPieces(id);
	return {
		owner: user.role === 'owner',
		fair: {
			id: fair.id,
			name: fair.name,
			place: fair.place,
			startsOn: fair.startsOn,
			endsOn: fair.endsOn,
			closed: Boolean(fair.closedAt),
			notes: fair.notes
		},
		formValues: user.role === 'owner' ? fairFormValues(fair) : null,
		helpers: user.role === 'owner' ? await fairHelperChoices(id) : null,
		loaded: pieces.map((p) => ({
			key: p.fairStockId,
			title: p.title,
			woodName: p.woodName,
			loadedOut: p.loadedOut,
			onHand: p.onHand,
			returned: p.returned
		})),
		shelf: fair.closedAt ? [] : await workshopShelf(),
		// Voids and discarded entries, with who did them: the owner's view of the fair's history.
		history: user.role === 'owner' ? await fairHistory(id) : null
	};
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
