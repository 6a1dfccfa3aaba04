import { z } from 'zod';

/**
 * Plain sentences for the checks a schema states without its own message (a bare `.max(120)`),
 * so a form never shows zod's "Too big: expected string to have <=120 characters". A message
 * written in the schema still wins (zod's order: the schema's own, then this).
 */
export function plainMessage(issue: z.core.$ZodRawIssue): string | undefined {
	switch (issue.code) {
		case 'too_big':
			if (issue.origin === 'string')
				return `Keep it to ${Number(issue.maximum)} characters or fewer.`;
			if (issue.origin === 'array' || issue.origin === 'set')
				return `Choose at most ${Number(issue.maximum)}.`;
			return `Use a number of at most ${Number(issue.maximum)}.`;
		case 'too_small':
			if (issue.origin === 'string')
				return Number(issue.minimum) <= 1
					? 'Fill this in.'
					: `Use at least ${Number(issue.minimum)} characters.`;
			if (issue.origin === 'array' || issue.origin === 'set') return 'Choose at least one.';
			return `Use a number of at least ${Number(issue.minimum)}.`;
		case 'invalid_type':
			if (issue.input === undefined || issue.input === null || issue.input === '')
				return 'Fill this in.';
			if (issue.expected === 'number' || issue.expected === 'int') return 'Type a number.';
			return 'Check this value.';
		case 'invalid_format':
			if (issue.format === 'email') return 'Type an e-mail address, like name@example.com.';
			if (issue.format === 'date') return 'Pick a date.';
			return 'Check the format of this value.';
		case 'invalid_value':
			return 'Choose one of the options offered.';
		case 'not_multiple_of':
			return 'Use a whole number.';
		default:
			return undefined;
	}
}

/** Installed once per process by the server hooks. */
export function usePlainMessages(): void {
	z.config({ customError: plainMessage });
}
