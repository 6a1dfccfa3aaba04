import type { Handle } from '@sveltejs/kit';

// Replaced by the session handle once sign-in lands.
export const handle: Handle = async ({ event, resolve }) => {
	event.locals.user = null;
	event.locals.session = null;
	return resolve(event);
};
