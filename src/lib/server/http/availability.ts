import type { Handle, RequestEvent } from '@sveltejs/kit';

/**
 * While MariaDB is unreachable every page and API answers 503 with a short plain page (or JSON
 * under /api/) and a Retry-After, instead of a 500 with a stack trace. Nothing here holds state
 * about the outage: the pool makes new connections as requests come in, so the first request
 * after the database is back is served normally, with no restart.
 */

/** Error codes mysql2 gives when the server is down, restarting or the link dropped. */
const DOWN_CODES = new Set([
	'ECONNREFUSED',
	'ECONNRESET',
	'ETIMEDOUT',
	'EPIPE',
	'EHOSTUNREACH',
	'PROTOCOL_CONNECTION_LOST',
	'PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR',
	'ER_SERVER_SHUTDOWN',
	'ER_CON_COUNT_ERROR',
	'ER_CONNECTION_KILLED',
	'ER_SERVER_GONE_ERROR',
	'ER_SERVER_LOST',
	'ER_QUERY_INTERRUPTED',
	// The server answers but refuses the app's account (a password changed on one side only):
	// to a visitor that is the same outage.
	'ER_ACCESS_DENIED_ERROR'
]);
/** The same by MariaDB error number (1045 access denied, 1053 shutdown, 1927 connection killed, 2006/2013 gone). */
const DOWN_ERRNOS = new Set([1045, 1053, 1040, 1927, 2002, 2003, 2006, 2013]);

/**
 * mysql2's words for a connection that already died: a query (often the ROLLBACK a transaction
 * sends after its first error) on it fails with one of these, carrying no code.
 */
const CLOSED = /connection is in closed state|can't write in closed state|pool is closed/i;

/**
 * True when `err` (or anything in its `cause` chain, e.g. drizzle's wrapper around the ROLLBACK
 * that failed) means "database down". mysql2 marks errors that end a connection `fatal`.
 */
export function isDatabaseDown(err: unknown): boolean {
	for (let e = err, depth = 0; e && typeof e === 'object' && depth < 6; depth++) {
		const { code, errno, cause, fatal, message } = e as {
			code?: unknown;
			errno?: unknown;
			cause?: unknown;
			fatal?: unknown;
			message?: unknown;
		};
		if (typeof code === 'string' && DOWN_CODES.has(code)) return true;
		if (typeof errno === 'number' && DOWN_ERRNOS.has(errno)) return true;
		if (fatal === true) return true;
		if (typeof message === 'string' && CLOSED.test(message)) return true;
		e = cause;
	}
	return false;
}

const downRequests = new WeakSet<Request>();

/** Called from `handleError`: remembers that this request failed because the database is down. */
export function noteDatabaseDown(event: Pick<RequestEvent, 'request'>, err: unknown): boolean {
	if (!isDatabaseDown(err)) return false;
	downRequests.add(event.request);
	return true;
}

const PAGE = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>Back in a moment · Chipstall</title></head>
<body style="font-family:system-ui,sans-serif;max-width:36rem;margin:3rem auto;padding:0 1rem;color:#2e2118;background:#f6efe3">
<h1>Back in a moment</h1>
<p>The shop cannot reach its records just now. Nothing you already sent us is lost.
Please try again in a few seconds.</p>
</body></html>`;

export function unavailable(event: Pick<RequestEvent, 'url'>): Response {
	const headers = { 'retry-after': '5', 'cache-control': 'no-store' };
	if (event.url.pathname.startsWith('/api/')) {
		return Response.json(
			{ error: 'The shop cannot reach its records just now. Try again in a few seconds.' },
			{ status: 503, headers }
		);
	}
	return new Response(PAGE, {
		status: 503,
		headers: { ...headers, 'content-type': 'text/html; charset=utf-8' }
	});
}

/** First in the sequence, so it also sees a session look-up that failed in a later handle. */
export const availabilityHandle: Handle = async ({ event, resolve }) => {
	let response: Response;
	try {
		response = await resolve(event);
	} catch (err) {
		if (isDatabaseDown(err)) return unavailable(event);
		throw err;
	}
	if (response.status >= 500 && downRequests.has(event.request)) return unavailable(event);
	return response;
};
