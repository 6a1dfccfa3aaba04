import { redirect } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import { createFair, listFairs } from '$lib/server/fairs/fairs';
import { fairTally } from '$lib/server/booth/tally';
import { helperFairIds } from '$lib/server/fairs/fair-helpers';
import { fairFormSchema } from '$lib/fairs/schemas';
import { parseForm } from '$lib/forms/parse-form';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'owner', 'helper');
	const owner = user.role === 'owner';
	// A helper sees the fairs the owner named them for.
	const mine = owner ? null : await helperFairIds(user.id);
	const fairs = (await listFairs()).filter((f) => !mine || mine.has(f.id));
	return {
		owner,
		fairs: await Promise.all(
			fairs.map(async (f) => ({
				id: f.id,
				name: f.name,
				place: f.place,
				startsOn: f.startsOn,
				endsOn: f.endsOn,
				closed: Boolean(f.closedAt),
				currency: f.currency,
				// Money stays with the owner (helpers see counts, never the net or the fees).
				netMinor: owner ? (await fairTally(f.id)).result.net : null
			}))
		)
	};
};

export const actions: Actions = {
	create: async (event) => {
		requireRole(event, 'owner');
		const parsed = await parseForm(event.request, fairFormSchema);
		if (!parsed.ok) return parsed.failure;
		const id = await createFair(parsed.data);
		redirect(303, `/workshop/fairs/${id}`);
	}
};
