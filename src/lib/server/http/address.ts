import type { Handle } from '@sveltejs/kit';
import { dev } from '$app/environment';
import { config } from '$lib/server/config';

/**
 * The shop has one public address, ORIGIN. A browser that reached it under another name of the
 * same server (http://127.0.0.1:3000 for http://localhost:3000) would have every form refused by
 * the cross-site form check, so page requests are sent to ORIGIN first, and a form that is still
 * refused gets a page saying why and where to go instead of a bare "403 Forbidden".
 *
 * adapter-node builds `event.url` from ORIGIN, so the address the browser used is read from the
 * request's own Host header. X-Forwarded-Host is not trusted to move anyone anywhere (the adapter
 * is not told to trust it); it only stops a redirect when a proxy in front says the visitor
 * already used the right host.
 */

/**
 * The content types an HTML form can send without a CORS preflight, plus SvelteKit's own form
 * encoding: the requests the cross-site check covers (as SvelteKit's built-in check, and the
 * OWASP CSRF Prevention Cheat Sheet's "verifying origin with standard headers").
 */
const FORM_TYPES = new Set([
	'application/x-www-form-urlencoded',
	'multipart/form-data',
	'text/plain',
	'application/x-sveltekit-formdata'
]);
const WRITE_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

export function isFormWrite(request: Request): boolean {
	if (!WRITE_METHODS.has(request.method)) return false;
	const type = request.headers.get('content-type')?.split(';', 1)[0].trim().toLowerCase() ?? '';
	return FORM_TYPES.has(type);
}

/** The host the browser used when it is not the origin's (null when it is, or cannot be told). */
export function otherHost(request: Request, origin: URL): string | null {
	return otherHostOf(
		request.headers.get('host') ?? undefined,
		request.headers.get('x-forwarded-host') ?? undefined,
		origin
	);
}

/** The same from the Host and X-Forwarded-Host values (the page cache's front reads them raw). */
export function otherHostOf(
	hostHeader: string | undefined,
	forwardedHeader: string | undefined,
	origin: URL
): string | null {
	const host = hostHeader?.trim().toLowerCase();
	if (!host || host === origin.host) return null;
	const forwarded = forwardedHeader?.split(',', 1)[0].trim().toLowerCase();
	if (forwarded === origin.host) return null;
	return host;
}

/**
 * Where to send someone whose form was refused: the page they were on when that page came from
 * this same server under another name (its Referer names the host the form was sent to), else the
 * form's own address; either way at ORIGIN.
 */
export function rightAddress(request: Request, origin: URL): string {
	const host = request.headers.get('host')?.toLowerCase();
	const referer = request.headers.get('referer');
	let path = new URL(request.url).pathname;
	if (referer && host) {
		try {
			const r = new URL(referer);
			if (r.host === host) path = r.pathname + r.search;
		} catch {
			// An unreadable Referer: the form's own address will do.
		}
	}
	return new URL(path, origin).href;
}

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

export function refusalMessage(from: string | null, origin: URL): string {
	const sender = from && from !== 'null' ? from : 'a page we cannot name';
	return (
		`This form was sent from ${sender}, but the shop only takes forms sent from its own address, ` +
		`${origin.origin}, so that no other site can send one in your name. ` +
		`Nothing was changed. Open the shop at ${origin.origin} and try again.`
	);
}

/** The refusal, in the shape the sender can show: JSON under /api/, an action result, or a page. */
export function refusal(request: Request, origin: URL): Response {
	const message = refusalMessage(request.headers.get('origin'), origin);
	const address = rightAddress(request, origin);
	const path = new URL(request.url).pathname;
	const noStore = { 'cache-control': 'no-store' };
	if (path.startsWith('/api/')) {
		return Response.json({ error: message, address }, { status: 403, headers: noStore });
	}
	if (request.headers.get('x-sveltekit-action') === 'true') {
		// `use:enhance` shows an action's error result on the error page, with its link.
		return Response.json(
			{ type: 'error', status: 403, error: { message, address } },
			{ status: 403, headers: noStore }
		);
	}
	if (request.headers.get('accept') === 'application/json') {
		return Response.json({ error: message, address }, { status: 403, headers: noStore });
	}
	const page = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>Open the shop at its own address · Chipstall</title>
<style>body{font-family:system-ui,sans-serif;max-width:36rem;margin:3rem auto;padding:0 1rem;color:#2e2118;background:#f6efe3;line-height:1.5}a{color:#7a3e12;font-weight:700}</style>
</head><body><main>
<h1>Open the shop at its own address</h1>
<p>${escape(message)}</p>
<p><a href="${escape(address)}" data-testid="right-address">Go to ${escape(address)}</a></p>
</main></body></html>`;
	return new Response(page, {
		status: 403,
		headers: {
			...noStore,
			'content-type': 'text/html; charset=utf-8',
			// Only the page's own style block; nothing runs.
			'content-security-policy':
				"default-src 'none'; style-src 'unsafe-inline'; frame-ancestors 'none'"
		}
	});
}

/**
 * Before everything that answers from a cache: the redirect for page requests under another host
 * name, then the cross-site form check SvelteKit would otherwise make with a bare text answer
 * (its own is turned off in svelte.config.js so this one can explain itself).
 */
export const addressHandle: Handle = async ({ event, resolve }) => {
	const { request } = event;
	const origin = new URL(event.url.origin);
	if (
		(request.method === 'GET' || request.method === 'HEAD') &&
		config.redirectOtherHosts &&
		otherHost(request, origin)
	) {
		const raw = new URL(request.url);
		return new Response(null, {
			status: 308,
			headers: {
				location: new URL(raw.pathname + raw.search, origin).href,
				'cache-control': 'no-store'
			}
		});
	}
	// As SvelteKit's own check: not while developing (vite dev has no ORIGIN to compare with).
	if (!dev && isFormWrite(request) && request.headers.get('origin') !== origin.origin) {
		return refusal(request, origin);
	}
	return resolve(event);
};
