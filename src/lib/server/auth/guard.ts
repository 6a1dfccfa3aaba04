import { error, redirect, type RequestEvent } from '@sveltejs/kit';
import type { Role } from '../db/schema';

type GuardEvent = Pick<RequestEvent, 'locals' | 'url'>;

/**
 * Called in every workshop load and action, where the data is touched (a layout check alone
 * does not rerun on every navigation). Anonymous → sign-in page; wrong role → 403.
 */
export function requireRole(event: GuardEvent, ...allowed: Role[]) {
	const user = event.locals.user;
	if (!user) {
		redirect(303, `/signin?next=${encodeURIComponent(event.url.pathname + event.url.search)}`);
	}
	if (!allowed.includes(user.role)) {
		error(403, 'Your account cannot open this part of the workshop.');
	}
	return user;
}

/** The same check for JSON endpoints: 401 / 403 as JSON `{ error }` instead of a redirect. */
export function requireRoleApi(event: GuardEvent, ...allowed: Role[]) {
	const user = event.locals.user;
	if (!user) {
		error(401, 'Sign in first.');
	}
	if (!allowed.includes(user.role)) {
		error(403, 'Your account cannot use this.');
	}
	return user;
}

export const WORKSHOP_STAFF: Role[] = ['owner', 'helper'];
