import { fail } from '@sveltejs/kit';
import type { z } from 'zod';

/**
 * The one way a form action reads its input and answers bad input: every action parses with its
 * zod schema through `parseForm` and, when that fails, returns `fail(400, { errors, values })`, so
 * every page shows messages beside its fields and refills what was typed the same way.
 */

/** `{ field: [messages] }`; an issue about the whole form stands under `form`. */
export type FieldErrors = Record<string, string[]>;
/** What was typed, by field name, for refilling the form. */
export type FormValues = Record<string, string>;

/**
 * zod issues → `{ field: [messages] }`. A field is named by its object keys joined with dots
 * (`address.city`), the way nested inputs are named; a position in a list belongs to the field
 * that holds the list (`woodIds.2` → `woodIds`), since that is the input the message goes beside.
 */
export function fieldErrors(error: z.ZodError | readonly z.core.$ZodIssue[]): FieldErrors {
	const issues = 'issues' in error ? error.issues : error;
	const out: FieldErrors = {};
	for (const issue of issues) {
		const key = issue.path.filter((p) => typeof p === 'string').join('.') || 'form';
		(out[key] ??= []).push(issue.message);
	}
	return out;
}

/**
 * A posted field as text for refilling a form: a file (or a missing field) gives the fallback
 * rather than "[object File]".
 */
export function formText(v: FormDataEntryValue | null | undefined, fallback = ''): string {
	return typeof v === 'string' ? v : fallback;
}

/** Every posted text field by name (files dropped; a repeated name keeps its last value). */
export function formTexts(form: FormData): FormValues {
	const out: FormValues = {};
	for (const [k, v] of form.entries()) if (typeof v === 'string') out[k] = v;
	return out;
}

/** Fields never sent back to the page: a password must not linger in the HTML. */
const SECRET = /password/i;

/** The posted text fields to refill a form with, without passwords. */
export function formValues(form: FormData): FormValues {
	const out: FormValues = {};
	for (const [k, v] of Object.entries(formTexts(form))) if (!SECRET.test(k)) out[k] = v;
	return out;
}

type ParseOptions<E extends object> = {
	/** Added to the 400 answer, e.g. `{ form: 'ship' }` when a page holds several forms. */
	extra?: E;
	/** Builds the schema's input when it is not simply the text fields (nested or listed fields). */
	input?: (texts: FormValues, form: FormData) => unknown;
};

/**
 * Reads a posted form and parses it with `schema`. On success: the data, the values typed and the
 * raw FormData. On failure: `failure` is the `fail(400, { errors, values, ...extra })` to return.
 */
export async function parseForm<S extends z.ZodType, E extends object = object>(
	source: Request | FormData,
	schema: S,
	options: ParseOptions<E> = {}
) {
	const form = source instanceof FormData ? source : await source.formData();
	const texts = formTexts(form);
	const values = formValues(form);
	const parsed = schema.safeParse(options.input ? options.input(texts, form) : texts);
	if (parsed.success) {
		return { ok: true as const, data: parsed.data, values, form };
	}
	const errors = fieldErrors(parsed.error);
	return {
		ok: false as const,
		errors,
		values,
		failure: fail(400, { ...(options.extra ?? ({} as E)), errors, values })
	};
}

/** The first message, for a form that shows one line rather than a message per field. */
export function firstError(errors: FieldErrors | undefined): string | undefined {
	return Object.values(errors ?? {})[0]?.[0];
}
