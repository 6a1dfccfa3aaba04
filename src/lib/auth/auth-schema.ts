import { z } from 'zod';
import { emailAddress } from '../forms/email';
import { plain } from '../forms/plain-text';

const newPassword = z
	.string({ error: 'Choose a password.' })
	.min(10, 'Use at least 10 characters.')
	.max(200, 'Use at most 200 characters.');

/** Every account field once; the forms below pick what they need. */
export const accountFields = z.object({
	name: plain(
		z
			.string({ error: 'Tell us your name.' })
			.trim()
			.min(1, 'Tell us your name.')
			.max(120, 'Keep the name under 120 characters.')
	),
	email: emailAddress,
	password: newPassword,
	confirm: z.string({ error: 'Type the password again.' }).min(1, 'Type the password again.')
});

const passwordsMatch = (v: { password: string; confirm: string }) => v.password === v.confirm;
const mismatch = { message: 'The two passwords are not the same.', path: ['confirm'] };

/** Sign-in does not apply the length rule: an older, shorter password still has to work. */
export const signInSchema = accountFields.pick({ email: true }).extend({
	password: z
		.string({ error: 'Enter your password.' })
		.min(1, 'Enter your password.')
		.max(200, 'That is longer than any password here: passwords have at most 200 characters.')
});

export const signUpSchema = accountFields.refine(passwordsMatch, mismatch);

export const resetRequestSchema = accountFields.pick({ email: true });

export const resetPasswordSchema = accountFields
	.pick({ password: true, confirm: true })
	.refine(passwordsMatch, mismatch);

/** The owner adds a helper with a temporary password they pass on in person. */
export const addHelperSchema = accountFields.pick({ name: true, email: true, password: true });

export const promoteSchema = accountFields.pick({ email: true });

export const removeHelperSchema = z.object({
	userId: z.uuid('Choose a helper from the list.')
});

export type FieldErrors = Partial<Record<string, string[]>>;
