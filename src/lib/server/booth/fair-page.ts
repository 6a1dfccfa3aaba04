import type { Role } from '../db/schema';
import { fairHistory } from './void';
import { fairHelperChoices } from '../fairs/fair-helpers';
import { fairPieces, type Fair } from '../fairs/fairs';
import { workshopShelf } from '../fairs/load-out';
import { fairFormValues } from '$lib/fairs/form-values';

/**
 * What a fair's page shows to whom: the owner also gets the form, the helpers' names and the
 * history of voids and discards; a helper sees the fair and its stock, never money or history.
 */
export async function fairPage(fair: Fair, role: Role) {
	const owner = role === 'owner';
	const pieces = await fairPieces(fair.id);
	return {
		owner,
		fair: {
			id: fair.id,
			name: fair.name,
			place: fair.place,
			startsOn: fair.startsOn,
			endsOn: fair.endsOn,
			closed: Boolean(fair.closedAt),
			notes: fair.notes
		},
		formValues: owner ? fairFormValues(fair) : null,
		helpers: owner ? await fairHelperChoices(fair.id) : null,
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
		history: owner ? await fairHistory(fair.id) : null
	};
}
