/**
 * Card checks on the stand-in's payment page. Test numbers and their outcomes follow Stripe's
 * published testing docs; any other number is refused the way test mode refuses real cards.
 */
export type CardInput = {
	number: string;
	expiry: string;
	cvc: string;
	name: string;
};
export type CardFieldErrors = Partial<Record<keyof CardInput, string>>;
export type Decline = { code: string; decline_code: string; message: string };
export type CardResult =
	| { ok: true; last4: string; brand: string }
	| { ok: false; fieldErrors: CardFieldErrors }
	| { ok: false; decline: Decline };

const SUCCEEDS: Record<string, string> = {
	'4242424242424242': 'visa',
	'4000056655665556': 'visa',
	'5555555555554444': 'mastercard',
	'2223003122003222': 'mastercard',
	'378282246310005': 'amex',
	'6011111111111117': 'discover'
};

const generic = {
	code: 'card_declined',
	decline_code: 'generic_decline',
	message: 'Your card was declined.'
};
const DECLINES: Record<string, Decline> = {
	'4000000000000002': generic,
	'4000000000009995': {
		code: 'card_declined',
		decline_code: 'insufficient_funds',
		message: 'Your card has insufficient funds.'
	},
	'4000000000000069': {
		code: 'expired_card',
		decline_code: 'expired_card',
		message: 'Your card has expired.'
	},
	'4000000000000127': {
		code: 'incorrect_cvc',
		decline_code: 'incorrect_cvc',
		message: "Your card's security code is incorrect."
	},
	'4000000000000119': {
		code: 'processing_error',
		decline_code: 'processing_error',
		message: 'An error occurred while processing your card. Try again in a little bit.'
	}
};

export function luhnValid(digits: string) {
	let sum = 0;
	for (let i = 0; i < digits.length; i++) {
		let d = Number(digits[digits.length - 1 - i]);
		if (i % 2 === 1) {
			d *= 2;
			if (d > 9) d -= 9;
		}
		sum += d;
	}
	return sum % 10 === 0;
}

export function checkCard(input: CardInput, now = new Date()): CardResult {
	const errors: CardFieldErrors = {};
	const digits = input.number.replace(/[\s-]/g, '');
	if (!digits) errors.number = 'Enter the card number.';
	else if (!/^\d{12,19}$/.test(digits))
		errors.number = 'The card number should be 12 to 19 digits.';
	else if (!luhnValid(digits)) errors.number = 'That card number is not valid; check for a typo.';

	const exp = input.expiry.trim().match(/^(\d{1,2})\s*\/\s*(\d{2}|\d{4})$/);
	const month = exp ? Number(exp[1]) : 0;
	const year = exp ? (exp[2].length === 2 ? 2000 + Number(exp[2]) : Number(exp[2])) : 0;
	if (!input.expiry.trim()) errors.expiry = 'Enter the expiry date as MM/YY.';
	else if (!exp || month < 1 || month > 12)
		errors.expiry = 'Write the expiry date as MM/YY, e.g. 04/29.';
	// A card is good through the last day of its expiry month.
	else if (year * 12 + month < now.getFullYear() * 12 + now.getMonth() + 1)
		errors.expiry = 'That expiry date is in the past.';

	const amex = /^3[47]/.test(digits);
	const cvc = input.cvc.trim();
	if (!cvc) errors.cvc = 'Enter the security code from the card.';
	else if (!(amex ? /^\d{4}$/ : /^\d{3}$/).test(cvc))
		errors.cvc = amex
			? 'The security code is 4 digits on this card.'
			: 'The security code is 3 digits.';

	if (!input.name.trim()) errors.name = 'Enter the name on the card.';
	else if (input.name.length > 100) errors.name = 'The name is too long.';

	if (Object.keys(errors).length) return { ok: false, fieldErrors: errors };
	if (DECLINES[digits]) return { ok: false, decline: DECLINES[digits] };
	if (SUCCEEDS[digits]) return { ok: true, last4: digits.slice(-4), brand: SUCCEEDS[digits] };
	return {
		ok: false,
		decline: {
			...generic,
			message:
				'Your card was declined. This is a test payment page: use a test card number such as 4242 4242 4242 4242.'
		}
	};
}
