import { redirect } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import { allWoods, createPiece } from '$lib/server/catalogue/pieces-admin';
import { savePieceForm } from '$lib/server/catalogue/piece-forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'owner');
	return { woods: await allWoods() };
};

export const actions: Actions = {
	default: async (event) => {
		requireRole(event, 'owner');
		const out = await savePieceForm(event.request, createPiece);
		if (out.failure) return out.failure;
		redirect(303, `/workshop/pieces/${out.result as number}?created=1`);
	}
};
