import { json } from '@sveltejs/kit';
import type { z } from 'zod';
import { fieldErrors, type FieldErrors } from '$lib/forms/parse-form';
import { DomainError } from '../errors/domain-error';

/**
 * The one place API errors are shaped. Every JSON route answers a refusal as `{ error, fields? }`
 * with its 4xx status through `apiError` / `apiInvalid`, a DomainError through `orApiError`, and
 * the `apiErrors` hook passes any other error response (a thrown `error()`, a 404 from the router)
 * through `toApiErrorResponse`.
 */

/** JSON error body used by every API route. */
export function apiError(status: number, message: string, fields?: FieldErrors) {
	return json({ error: message, ...(fields ? { fields } : {}) }, { status });
}

/** 400 for input its zod schema refused: the first message as the error, all of them by field. */
export function apiInvalid(
	error: z.ZodError,
	message = error.issues[0]?.message ?? 'Check the request.'
) {
	return apiError(400, message, fieldErrors(error));
}

/** A DomainError as the API's answer: its status, its sentence and its fields. */
export function apiFrom(err: DomainError) {
	return apiError(err.status, err.message, err.fields);
}

/**
 * The one adapter from a DomainError to a JSON route's answer: runs the route's work and answers
 * a DomainError (from the domain, or from `readJson`) with `apiFrom`. Anything else is a fault
 * and is thrown on.
 */
export async function orApiError(run: () => Promise<Response>): Promise<Response> {
	try {
		return await run();
	} catch (err) {
		if (err instanceof DomainError) return apiFrom(err);
		throw err;
	}
}

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
