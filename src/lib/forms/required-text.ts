import { z } from 'zod';

/** A text that must be given, trimmed, with messages that name it: "Enter the fair’s name." */
export const requiredText = (label: string, max: number) =>
	z
		.string({ error: `Enter ${label}.` })
		.trim()
		.min(1, `Enter ${label}.`)
		.max(max, `Keep ${label} under ${max} characters.`);
