import { redirect } from '@sveltejs/kit';
import { clearSessionCookie, invalidateSession } from '$lib/server/auth/lucia';
import type { Actions, PageServerLoad } from './$types';

/** A visit (GET) only asks; signing out is a POST, so a link or a prefetch cannot do it. */
export const load: PageServerLoad = ({ locals }) => {
	if (!locals.user) redirect(303, '/');
	return { name: locals.user.name };
};

export const actions: Actions = {
	default: async ({ locals, cookies, url }) => {
		if (locals.session) await invalidateSession(locals.session.id);
		clearSessionCookie(cookies, url.protocol === 'https:');
		redirect(303, '/');
	}
};
