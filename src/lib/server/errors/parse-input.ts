import type { z } from 'zod';
import { fieldErrors } from '$lib/forms/parse-form';
import { DomainError } from './domain-error';

/**
 * Parses a JSON route's input with its zod schema, or throws a DomainError 400: the first message
 * (or `message`) as the sentence, every message by field, as `apiInvalid` answers.
 */
export function parseInput<S extends z.ZodType>(schema: S, value: unknown, message?: string) {
	const parsed = schema.safeParse(value);
	if (parsed.success) return parsed.data;
	throw new DomainError(400, message ?? parsed.error.issues[0]?.message ?? 'Check the request.', {
		fields: fieldErrors(parsed.error)
	});
}
