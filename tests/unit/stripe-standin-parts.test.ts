import { describe, expect, it } from 'vitest';
import { checkCard, luhnValid } from '../../mocks/stripe/cards';
import { parseForm } from '../../mocks/stripe/form';
import { money } from '../../mocks/stripe/pay-page';

const card = { number: '', expiry: '12/39', cvc: '123', name: 'Hollis Marsh' };

describe('stand-in card checks', () => {
	it('accepts the Luhn check digit of Stripe published test numbers and rejects a changed digit', () => {
		// Source: Stripe docs "Testing" (test card numbers); Luhn per ISO/IEC 7812-1.
		expect(luhnValid('4242424242424242')).toBe(true);
		expect(luhnValid('4000000000000002')).toBe(true);
		expect(luhnValid('5555555555554444')).toBe(true);
		expect(luhnValid('378282246310005')).toBe(true);
		expect(luhnValid('4242424242424241')).toBe(false);
	});

	it('4242… succeeds and 4000…0002 is a generic decline (Stripe docs "Testing")', () => {
		expect(checkCard({ ...card, number: '4242 4242 4242 4242' })).toMatchObject({
			ok: true,
			last4: '4242'
		});
		expect(checkCard({ ...card, number: '4000-0000-0000-0002' })).toMatchObject({
			ok: false,
			decline: { decline_code: 'generic_decline', message: 'Your card was declined.' }
		});
	});

	it('a card is good through the end of its expiry month', () => {
		const now = new Date(2030, 4, 31); // 31 May 2030
		expect(checkCard({ ...card, number: '4242424242424242', expiry: '05/30' }, now).ok).toBe(true);
		const past = checkCard({ ...card, number: '4242424242424242', expiry: '04/30' }, now);
		expect(past).toMatchObject({
			ok: false,
			fieldErrors: { expiry: 'That expiry date is in the past.' }
		});
	});

	it('asks for a 4-digit security code on American Express numbers', () => {
		const r = checkCard({ ...card, number: '378282246310005', cvc: '123' });
		expect(r).toMatchObject({
			fieldErrors: { cvc: 'The security code is 4 digits on this card.' }
		});
	});
});

describe('stand-in form parser', () => {
	it('ignores prototype keys, so a body cannot pollute Object.prototype (OWASP Prototype Pollution Prevention Cheat Sheet)', () => {
		const form = parseForm('__proto__[polluted]=yes&a[constructor][prototype][b]=1&ok=1');
		expect(({} as Record<string, unknown>).polluted).toBeUndefined();
		expect((Object.prototype as Record<string, unknown>).b).toBeUndefined();
		expect(form).toEqual({ ok: '1' });
	});

	it('reads the bracket keys the SDK writes into nested objects and arrays', () => {
		const body =
			'mode=payment&line_items[0][quantity]=2&line_items[0][price_data][unit_amount]=4500' +
			'&line_items[1][quantity]=1&metadata[order_ref]=LF-1&expand[0]=line_items&tags[]=a&tags[]=b' +
			'&success_url=http%3A%2F%2Flocalhost%2Fok%3Fs%3D%7BCHECKOUT_SESSION_ID%7D';
		expect(parseForm(body)).toEqual({
			mode: 'payment',
			line_items: [{ quantity: '2', price_data: { unit_amount: '4500' } }, { quantity: '1' }],
			metadata: { order_ref: 'LF-1' },
			expand: ['line_items'],
			tags: ['a', 'b'],
			success_url: 'http://localhost/ok?s={CHECKOUT_SESSION_ID}'
		});
	});
});

describe('pay page amounts', () => {
	it('uses ISO 4217 minor units: 2 for USD and EUR, 0 for JPY', () => {
		// Source: ISO 4217 minor-unit column, as carried by Intl in Node.
		expect(money(10250, 'usd')).toBe('$102.50');
		expect(money(900, 'eur')).toBe('€9.00');
		expect(money(1500, 'jpy')).toBe('¥1,500');
	});
});
