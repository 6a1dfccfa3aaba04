import type { Handle, HandleServerError } from '@sveltejs/kit';

// Replaced by the session handle once sign-in lands.
export const handle: Handle = async ({ event, resolve }) => {
	event.locals.user = null;
	event.locals.session = null;
	return resolve(event);
};

/** API routes answer errors as JSON `{ error }`; pages get the error page. */
export const handleError: HandleServerError = ({ message }) => ({ message });
