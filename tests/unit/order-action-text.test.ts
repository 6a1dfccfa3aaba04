/**
 * The free text of the order page's forms (note, reason to cancel or step back, why a move,
 * refund reason) refuses hidden characters: C0 controls such as NUL, and the bidirectional
 * override U+202E used to disguise text ("Trojan Source", CVE-2021-42574; OWASP ASVS 4.0 V5.1.4).
 * Line breaks stay allowed in a note (common practice for a multi-line note).
 */
import { describe, expect, it } from 'vitest';
import { moveSchema, noteSchema, steerSchema } from '$lib/orders/actions-schema';
import { refundFormSchema } from '$lib/orders/refund-schema';
import { HIDDEN_CHARACTERS_MESSAGE } from '$lib/forms/plain-text';

const NUL = 'Box\u0000dented';
const RLO = 'Box \u202edetned';

const message = (r: { success: boolean; error?: { issues: { message: string }[] } }) =>
	r.success ? null : r.error!.issues.map((i) => i.message);

describe('hidden characters in the order page’s free text', () => {
	it.each([NUL, RLO])('a note with %j is refused with the plain sentence', (body) => {
		expect(message(noteSchema.safeParse({ body }))).toEqual([HIDDEN_CHARACTERS_MESSAGE]);
	});
	it('a note keeps its line breaks', () => {
		expect(noteSchema.parse({ body: 'Called the buyer.\nShips Monday.' }).body).toContain('\n');
	});
	it.each([NUL, RLO])('a reason to cancel or step back with %j is refused', (reason) => {
		expect(message(steerSchema.safeParse({ reason, expect: 'paid' }))).toEqual([
			HIDDEN_CHARACTERS_MESSAGE
		]);
	});
	it.each([NUL, RLO])('why a move, with %j, is refused', (why) => {
		expect(message(moveSchema.safeParse({ to: 'carving', why }))).toEqual([
			HIDDEN_CHARACTERS_MESSAGE
		]);
	});
	it.each([NUL, RLO])('a refund reason with %j is refused', (reason) => {
		const r = refundFormSchema('USD').safeParse({ kind: 'full', reason });
		expect(message(r)).toEqual([HIDDEN_CHARACTERS_MESSAGE]);
	});
	it('plain reasons still pass', () => {
		expect(steerSchema.safeParse({ reason: 'Buyer asked', expect: 'paid' }).success).toBe(true);
		expect(refundFormSchema('USD').safeParse({ kind: 'full', reason: 'Cracked' }).success).toBe(
			true
		);
	});
});
