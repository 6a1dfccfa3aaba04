import { z } from 'zod';

/**
 * Characters no name, address line or note needs, and that are used to hide or disguise text:
 * C0/C1 control characters (NUL included) and the Unicode bidirectional overrides, embeddings
 * and isolates (the "Trojan Source" characters, CVE-2021-42574) plus the directional marks.
 * OWASP ASVS 4.0 V5.1.4 (structured data checked against allowed characters).
 * A note may keep line breaks and tabs; a one-line field may not (they would let a name split
 * an e-mail header or a packing-slip line).
 */
// eslint-disable-next-line no-control-regex -- matching control characters is the point here
const CONTROLS_ONE_LINE = /[\u0000-\u001f\u007f-\u009f]/;
// eslint-disable-next-line no-control-regex -- as above, but tab, line feed and carriage return pass
const CONTROLS_MULTI_LINE = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f]/;
const BIDI = /[\u200e\u200f\u061c\u202a-\u202e\u2066-\u2069]/;

export const HIDDEN_CHARACTERS_MESSAGE =
	'Remove the hidden control or text-direction characters (they often come with pasted text).';

/** Whether a piece of free text is free of hidden characters. */
export function isPlainText(s: string, multiline = false): boolean {
	return !(multiline ? CONTROLS_MULTI_LINE : CONTROLS_ONE_LINE).test(s) && !BIDI.test(s);
}

/** A string schema that also refuses hidden characters, with a message. */
export function plain<T extends z.ZodType<string, string>>(schema: T, multiline = false) {
	return schema.refine((s) => isPlainText(s, multiline), HIDDEN_CHARACTERS_MESSAGE);
}

/** A piece's address: lower-case letters, digits and single hyphens (no NUL, no spaces). */
export const PIECE_SLUG = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;
