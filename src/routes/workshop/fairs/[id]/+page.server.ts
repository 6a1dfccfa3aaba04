import { fail } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import { fairPieces, getFair, updateFair } from '$lib/server/fairs/fairs';
import { loadOut, workshopShelf } from '$lib/server/fairs/load-out';
import { fairHistory } from '$lib/server/booth/void';
import { fairIdParam, orFail, orPageError } from '$lib/server/booth/http';
import {
	assertFairAccess,
	fairHelperChoices,
	setFairHelpers
} from '$lib/server/fairs/fair-helpers';
import { fairFormSchema, loadOutLineSchema } from '$lib/fairs/schemas';
import { fairFormValues } from '$lib/fairs/form-values';
import { formTexts, parseForm } from '$lib/forms/parse-form';
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
		const form = formTexts(await event.request.formData());
		const lines: { pieceId: number; woodId: number; quantity: number }[] = [];
		// One input per shelf row (take-<piece>-<wood>), so each row is parsed on its own.
		for (const [key, value] of Object.entries(form)) {
			const m = /^take-(\d+)-(\d+)$/.exec(key);
			if (!m || value.trim() === '' || value.trim() === '0') continue;
			const parsed = loadOutLineSchema.safeParse({ pieceId: m[1], woodId: m[2], quantity: value });
			if (!parsed.success) {
				return fail(400, { loadOutError: parsed.error.issues[0].message, key });
			}
			lines.push(parsed.data);
		}
		return orFail(async () => {
			await loadOut(id, lines, user.id);
			return { loaded: lines.reduce((a, l) => a + l.quantity, 0) };
		});
	}
};
