/**
 * The limits themselves, one place for all of them. Window: `config.throttleWindowS` (15 min).
 * Sign-in (see auth/sign-in-throttle.ts) counts every attempt per account and client address
 * together, per address, and per account for devices the account has not signed in from; a
 * successful sign-in clears that address's count for the account. Reset and sign-up count per e-mail and per address; checkout counts the
 * pieces held per basket and per address; a buyer's message about an order counts per order
 * and per address. The pattern API has its own per-minute limit.
 */
import { config } from '../config';
import { Limiter } from './rate-limit';

const w = () => config.throttleWindowS;

export const throttles = {
	/** One account from one address: a person mistyping gets ten tries, a guesser no more. */
	signInPair: new Limiter({ prefix: 'signin-pair', points: 10, durationS: w() }),
	/** One account from devices it never signed in from, whatever the address. */
	signInAccount: new Limiter({ prefix: 'signin-acct', points: 50, durationS: w() }),
	signInAddress: new Limiter({ prefix: 'signin-ip', points: 300, durationS: w() }),
	resetEmail: new Limiter({ prefix: 'reset-mail', points: 5, durationS: w() }),
	resetAddress: new Limiter({ prefix: 'reset-ip', points: 30, durationS: w() }),
	signUpEmail: new Limiter({ prefix: 'signup-mail', points: 5, durationS: w() }),
	signUpAddress: new Limiter({ prefix: 'signup-ip', points: 30, durationS: w() }),
	checkoutBasket: new Limiter({ prefix: 'hold-basket', points: 10, durationS: w() }),
	checkoutAddress: new Limiter({ prefix: 'hold-ip', points: 40, durationS: w() }),
	/** A buyer writing to the shop about an order: per order and per client address. */
	orderMessage: new Limiter({ prefix: 'order-msg', points: 5, durationS: w() }),
	orderMessageAddress: new Limiter({ prefix: 'order-msg-ip', points: 20, durationS: w() }),
	/** Generous for a person or a page; a flood is refused from memory after the first second. */
	pattern: new Limiter({ prefix: 'pattern-ip', points: 600, durationS: 60 })
};
