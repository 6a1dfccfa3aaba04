import { requireRole } from '$lib/server/auth/guard';
import { listFairs } from '$lib/server/fairs/fairs';
import { helperFairIds } from '$lib/server/fairs/fair-helpers';
import type { PageServerLoad } from './$types';

/** The installed app's first page: the open fairs this person sells at, to the booth or tally. */
export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'owner', 'helper');
	const mine = user.role === 'owner' ? null : await helperFairIds(user.id);
	const fairs = (await listFairs()).filter((f) => !f.closedAt && (!mine || mine.has(f.id)));
	return {
		fairs: fairs.map((f) => ({
			id: f.id,
			name: f.name,
			place: f.place,
			startsOn: f.startsOn,
			endsOn: f.endsOn
		}))
	};
};
