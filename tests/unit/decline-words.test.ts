import { describe, expect, it } from 'vitest';
import { DECLINED, declineHeading } from '$lib/orders/decline-words';

// The reasons are the payment API's decline messages for its test cards (Stripe's testing
// documentation, "Declined payments"; also what mocks/stripe/cards.ts answers).
describe('declineHeading', () => {
	it('shows the generic decline once, without its full stop', () => {
		expect(declineHeading('Your card was declined.')).toBe('Your card was declined');
	});

	it('shows a specific reason as the heading', () => {
		expect(declineHeading('Your card has insufficient funds.')).toBe(
			'Your card has insufficient funds'
		);
		expect(declineHeading("Your card's security code is incorrect.")).toBe(
			"Your card's security code is incorrect"
		);
	});

	it('keeps only the first sentence of a longer reason', () => {
		expect(
			declineHeading('An error occurred while processing your card. Try again in a little bit.')
		).toBe('An error occurred while processing your card');
	});

	it('falls back to plain words when there is no usable reason', () => {
		expect(declineHeading(null)).toBe(DECLINED);
		expect(declineHeading('   ')).toBe(DECLINED);
		expect(declineHeading('x'.repeat(200))).toBe(DECLINED);
	});
});
