/**
 * SvelteKit answers an `error()` thrown in a +server.ts with `{ message }` (or with its HTML error
 * page when the caller asked for HTML). Our API promises `{ error, fields? }`: this rewrites any
 * error response into that shape, keeping the status and the message.
 */
const fallback: Record<number, string> = {
	400: 'The request was not valid.',
	401: 'Sign in first.',
	403: 'Your account cannot use this.',
	404: 'There is nothing at this address.',
	405: 'This address does not accept that method.',
	413: 'The request is too large.'
};

type Body = { error?: unknown; message?: unknown; fields?: unknown };

export async function toApiErrorResponse(response: Response): Promise<Response> {
	const type = response.headers.get('content-type') ?? '';
	let body: Body = {};
	if (type.includes('application/json')) {
		try {
			body = (await response.clone().json()) as Body;
		} catch {
			body = {};
		}
		if (typeof body.error === 'string') return response;
	}
	const message =
		typeof body.message === 'string'
			? body.message
			: (fallback[response.status] ??
				(response.status >= 500 ? 'Something went wrong on our side.' : 'The request failed.'));
	const headers = new Headers(response.headers);
	headers.set('content-type', 'application/json');
	headers.delete('content-length');
	return new Response(
		JSON.stringify({ error: message, ...(body.fields ? { fields: body.fields } : {}) }),
		{ status: response.status, headers }
	);
}
