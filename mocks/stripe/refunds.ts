import { ApiError, invalid, missing, noSuch } from './errors';
import type { Form } from './form';
import { newId } from './ids';
import * as p from './params';
import type { Charge, Refund, State } from './state';

const REASONS = ['duplicate', 'fraudulent', 'requested_by_customer'];

/** POST /v1/refunds: full when amount is left out, partial otherwise; never more than is left. */
export function createRefund(state: State, form: Form): Refund {
	p.onlyKnown(form, ['payment_intent', 'charge', 'amount', 'reason', 'metadata', 'expand']);
	const piId = p.str(form.payment_intent, 'payment_intent');
	const chargeId = p.str(form.charge, 'charge');
	if (!piId && !chargeId) throw missing('payment_intent');
	const pi = piId
		? state.paymentIntents.get(piId)
		: [...state.paymentIntents.values()].find((x) => x.latest_charge === chargeId);
	if (!pi)
		throw piId
			? noSuch('payment_intent', piId, 'payment_intent')
			: noSuch('charge', chargeId!, 'charge');
	if (pi.status !== 'succeeded' || !pi.latest_charge)
		throw invalid(
			'payment_intent',
			`This PaymentIntent (${pi.id}) does not have a successful charge to refund.`
		);

	const left = pi.amount_received - state.refundedOn(pi.id);
	if (left <= 0)
		throw new ApiError(
			400,
			'invalid_request_error',
			`Charge ${pi.latest_charge} has already been refunded.`,
			'charge_already_refunded'
		);
	const amount = p.int(form.amount, 'amount') ?? left;
	if (amount < 1)
		throw invalid(
			'amount',
			'Refund amount must be a positive integer.',
			'parameter_invalid_integer'
		);
	if (amount > left)
		throw new ApiError(
			400,
			'invalid_request_error',
			`Refund amount (${amount}) is greater than the unrefunded amount on the charge (${left}).`,
			'amount_too_large',
			'amount'
		);
	const reason = p.str(form.reason, 'reason') ?? null;
	if (reason && !REASONS.includes(reason))
		throw invalid('reason', `Invalid reason: must be one of ${REASONS.join(', ')}`);

	const refund: Refund = {
		id: newId('re'),
		object: 'refund',
		amount,
		charge: pi.latest_charge,
		created: state.now(),
		currency: pi.currency,
		metadata: p.metadata(form.metadata, 'metadata'),
		payment_intent: pi.id,
		reason,
		status: 'succeeded'
	};
	state.refunds.set(refund.id, refund);
	return refund;
}

/**
 * The charge as a `charge.refunded` event carries it: the total refunded so far and whether
 * nothing is left. The charge id is the intent's latest charge; metadata is the intent's, as
 * the real service copies it from the intent to the charge.
 */
export function chargeAfterRefund(state: State, refund: Refund): Charge {
	const pi = state.paymentIntents.get(refund.payment_intent)!;
	const refunded = state.refundedOn(pi.id);
	return {
		id: refund.charge,
		object: 'charge',
		amount: pi.amount_received,
		amount_captured: pi.amount_received,
		amount_refunded: refunded,
		captured: true,
		created: pi.created,
		currency: pi.currency,
		livemode: false,
		metadata: pi.metadata,
		paid: true,
		payment_intent: pi.id,
		receipt_email: pi.receipt_email,
		refunded: refunded >= pi.amount_received,
		status: 'succeeded'
	};
}

export function getRefund(state: State, id: string) {
	const r = state.refunds.get(id);
	if (!r) throw noSuch('refund', id);
	return r;
}
