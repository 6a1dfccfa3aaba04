import { sequence } from '@sveltejs/kit/hooks';
import type { Handle, HandleServerError, ServerInit } from '@sveltejs/kit';
import {
	clearSessionCookie,
	sessionCookieName,
	setSessionCookie,
	validateToken
} from '$lib/server/auth/lucia';
import { toApiErrorResponse } from '$lib/server/http/api-errors';
import { startHoldSweeper } from '$lib/server/orders/holds';
import { startCheckoutDetailsSweeper } from '$lib/server/cart/checkout-details';
import { startOutboxDrainer } from '$lib/server/mail/outbox';
import { addressHandle } from '$lib/server/http/address';
import { availabilityHandle, noteDatabaseDown } from '$lib/server/http/availability';
import { httpCacheHandle } from '$lib/server/http/http-cache';
import { pageCacheHandle } from '$lib/server/http/page-cache';
import { installPageCacheFront } from '$lib/server/http/page-cache-front';
import { photoCacheHandle } from '$lib/server/http/photo-cache';
import { bodyLimitFor, declaredTooLarge, settleUnreadBody } from '$lib/server/http/body-limit';
import { answerClientErrorsWithJson } from '$lib/server/http/client-errors';
import { refuseDefaultSecrets } from '$lib/server/http/secrets-check';
import { withSecurityHeaders } from '$lib/server/http/security-headers';
import { freshShopProfile, loadShopProfile } from '$lib/server/settings/shop-settings';
import { usePlainMessages } from '$lib/forms/plain-messages';

// Before any request is parsed: plain sentences for checks written without their own message.
usePlainMessages();

export const init: ServerInit = async () => {
	// Before anything else: a production start with the README's secrets stops here.
	refuseDefaultSecrets();
	// The shop's zone, locale, currency and words, held for every formatter in this process.
	await loadShopProfile().catch(() => undefined);
	answerClientErrorsWithJson();
	// Stored public pages answered before SvelteKit by the built server (page-cache-front.ts).
	installPageCacheFront();
	startHoldSweeper();
	startCheckoutDetailsSweeper();
	startOutboxDrainer();
};

/** The shop's zone, locale, currency and words as saved, even when another process saved them. */
const shopProfileHandle: Handle = async ({ event, resolve }) => {
	await freshShopProfile();
	return resolve(event);
};

/** Loads the signed-in user from the session cookie; renews or clears the cookie as needed. */
const sessionHandle: Handle = async ({ event, resolve }) => {
	event.locals.user = null;
	event.locals.session = null;
	const token = event.cookies.get(sessionCookieName);
	if (!token) return resolve(event);

	const https = event.url.protocol === 'https:';
	const { session, user } = await validateToken(token);
	if (!session) {
		clearSessionCookie(event.cookies, https);
		return resolve(event);
	}
	// lucia pushed the expiry forward: send the cookie again with the new lifetime.
	if (session.fresh) setSessionCookie(event.cookies, token, https);
	event.locals.session = { id: session.id, expiresAt: session.expiresAt };
	event.locals.user = { id: user.id, email: user.email, name: user.name, role: user.role };
	return resolve(event);
};

/**
 * Security headers on every response; `Retry-After` when a throttle said no (RFC 6585 §4); a body
 * left unread by an early answer is drained or the connection closed (body-limit.ts).
 */
const headers: Handle = async ({ event, resolve }) => {
	let resolved: Response;
	try {
		resolved = await resolve(event);
	} catch (err) {
		// A handle that threw would otherwise reach the visitor as SvelteKit's bare 500.
		console.error(err);
		resolved = new Response('Something went wrong on our side. Please try again in a moment.', {
			status: 500,
			headers: { 'content-type': 'text/plain; charset=utf-8', 'cache-control': 'no-store' }
		});
	}
	const response = withSecurityHeaders(resolved, event.url.protocol === 'https:');
	if (event.locals.retryAfterS)
		response.headers.set('retry-after', String(event.locals.retryAfterS));
	await settleUnreadBody(event.request, response);
	return response;
};

/** Every error under /api/ answers JSON `{ error, fields? }`, whatever threw it. */
const apiErrors: Handle = async ({ event, resolve }) => {
	if (event.url.pathname.startsWith('/api/')) {
		const limit = bodyLimitFor(event.url.pathname, event.request.headers.get('content-type'));
		const tooLarge = declaredTooLarge(event.request, limit);
		if (tooLarge) return tooLarge;
	}
	const response = await resolve(event);
	if (!event.url.pathname.startsWith('/api/') || response.status < 400) return response;
	return toApiErrorResponse(response);
};

// Headers first, so cached pages, 503s and errors all carry them; then the address check, before
// any cache answers.
export const handle = sequence(
	headers,
	addressHandle,
	photoCacheHandle,
	availabilityHandle,
	shopProfileHandle,
	pageCacheHandle,
	httpCacheHandle,
	sessionHandle,
	apiErrors
);

/** Unexpected errors: logged here in full, shown to the visitor without any detail. */
export const handleError: HandleServerError = ({ error, event, status, message }) => {
	// Database down: the availability handle turns this into a plain 503; no stack in the log.
	if (noteDatabaseDown(event, error)) return { message: 'Back in a moment.' };
	if (status === 404) return { message: 'There is nothing at this address.' };
	if (status < 500) return { message };
	console.error(error);
	return { message: 'Something went wrong on our side. Please try again in a moment.' };
};
