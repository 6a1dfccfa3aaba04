import { fail } from '@sveltejs/kit';
import type { z } from 'zod';

/**
 * The one way a form action reads its input and answers a refusal: every action parses with its
 * zod schema through `parseForm`, and every failure has one shape, made by `formFail`:
 * `{ message, errors, values?, ...extra }` — `message` one plain sentence for the whole answer,
 * `errors` the messages by field (a refusal about the whole form stands under `form`), `values`
 * what was typed, to refill the form. Pages read it the same way everywhere; a DomainError becomes
 * this shape through `orFail` / `failFrom` in `$lib/server/errors/form-answer`.
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

/** What every form action's `fail()` carries (plus the action's own extra keys, e.g. `form`). */
export type FormFailure<V = FormValues> = { message: string; errors: FieldErrors; values?: V };

/**
 * The one way to build a form action's failure: `fail(status, { message, errors, values?, ...extra })`.
 * Without `errors`, the message stands under `form` (a refusal about the whole form).
 */
export function formFail<E extends object = object, V = FormValues>(
	status: number,
	message: string,
	more: { errors?: FieldErrors; values?: V } & E = {} as E
) {
	const errors = more.errors ?? { form: [message] };
	return fail(status, { ...more, message, errors } as FormFailure<V> & E);
}

type ParseOptions<E extends object> = {
	/** Added to the 400 answer, e.g. `{ form: 'ship' }` when a page holds several forms. */
	extra?: E;
	/** Builds the schema's input when it is not simply the text fields (nested or listed fields). */
	input?: (texts: FormValues, form: FormData) => unknown;
};

/**
 * Reads a posted form and parses it with `schema`. On success: the data, the values typed and the
 * raw FormData. On failure: `failure` is the `formFail(400, …)` to return: the first message as
 * `message`, all of them by field, the values typed and `extra`.
 */
export async function parseForm<S extends z.ZodType, E extends object = object>(
	source: Request | FormData,
	schema: S,
	options: ParseOptions<E> = {}
) {
	// A body that is not a form at all reads as an empty one: the schema then says what is missing.
	const form =
		source instanceof FormData ? source : await source.formData().catch(() => new FormData());
	const texts = formTexts(form);
	const values = formValues(form);
	const input = options.input ? options.input(texts, form) : texts;
	const parsed = schema.safeParse(input);
	if (parsed.success) {
		return { ok: true as const, data: parsed.data, values, form };
	}
	const errors = fieldErrors(parsed.error);
	return {
		ok: false as const,
		errors,
		values,
		/** What the schema was given, for a page that refills from more than the text fields. */
		input,
		issues: parsed.error.issues,
		failure: formFail(400, firstError(errors) ?? 'Check the form.', {
			...(options.extra ?? ({} as E)),
			errors,
			values
		})
	};
}

/** The first message, for a form that shows one line rather than a message per field. */
export function firstError(errors: FieldErrors | undefined): string | undefined {
	return Object.values(errors ?? {})[0]?.[0];
}
