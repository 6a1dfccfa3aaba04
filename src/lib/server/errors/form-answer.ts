import { isActionFailure, type ActionFailure } from '@sveltejs/kit';
import type { z } from 'zod';
import { formFail, parseForm, type FormValues } from '$lib/forms/parse-form';
import { DomainError } from './domain-error';

/**
 * The one adapter from a DomainError to a form action's answer: `formFail(status, message,
 * { errors, ...more })`, the error's fields as `errors` (or its message under `form`).
 */
export function failFrom<E extends object = object, V = FormValues>(
	err: DomainError,
	more: { values?: V } & E = {} as E
) {
	return formFail<E, V>(err.status, err.message, {
		...more,
		errors: err.fields ?? { form: [err.message] }
	});
}

/**
 * Runs a domain call from a form action: its result, or the DomainError as the form's failure
 * (with `more`, e.g. `{ form: 'ship', values }`). Anything else is a fault and is thrown on.
 */
export async function orFail<T, E extends object = object, V = FormValues>(
	run: () => Promise<T>,
	more: { values?: V } & E = {} as E
) {
	try {
		return await run();
	} catch (err) {
		if (err instanceof DomainError) return failFrom<E, V>(err, more);
		throw err;
	}
}

/**
 * A form action's whole round: parse the posted form with `schema` (`parseForm`), run the domain
 * call with what it read, and answer its result, or the one failure shape for bad input or a
 * DomainError (with `extra`, e.g. `{ form: 'ship' }`, and the values typed).
 */
export async function runForm<S extends z.ZodType, T, E extends object = object>(
	request: Request,
	schema: S,
	run: (data: z.output<S>) => Promise<T>,
	extra: E = {} as E,
	input?: (texts: FormValues, form: FormData) => unknown
) {
	const parsed = await parseForm(request, schema, { extra, input });
	if (!parsed.ok) return parsed.failure;
	return orFail(() => run(parsed.data), { ...extra, values: parsed.values });
}

/** True when a form round answered with a failure; narrows the result either way. */
export function isFailure<T>(result: T): result is Extract<T, ActionFailure<object>> {
	return isActionFailure(result);
}
