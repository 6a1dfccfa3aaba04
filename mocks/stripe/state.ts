/**
 * In-memory objects of the Stripe stand-in, kept for the life of the process. Each is typed as
 * the fields it fills, picked from the `stripe` SDK's own types (for the API version the pinned
 * SDK speaks, `Stripe.API_VERSION`), and narrowed where the stand-in does less (payment mode,
 * hosted page, automatic capture): a field that a new SDK version renames, drops or retypes
 * fails `npm run check` here instead of drifting from what the app reads.
 */
import type Stripe from 'stripe';

export type Metadata = Stripe.Metadata;

export type Price = Pick<
	Stripe.Price,
	'id' | 'object' | 'active' | 'currency' | 'unit_amount' | 'livemode'
> & {
	product: string;
	type: Extract<Stripe.Price.Type, 'one_time'>;
	/** On the wire a decimal string; the SDK hands it to the app as its own `Decimal`. */
	unit_amount_decimal: string;
};

export type LineItem = Pick<
	Stripe.LineItem,
	| 'id'
	| 'object'
	| 'amount_discount'
	| 'amount_subtotal'
	| 'amount_tax'
	| 'amount_total'
	| 'currency'
	| 'description'
	| 'quantity'
> & { description: string; quantity: number; price: Price };

export type Session = Pick<
	Stripe.Checkout.Session,
	| 'id'
	| 'object'
	| 'amount_subtotal'
	| 'amount_total'
	| 'cancel_url'
	| 'client_reference_id'
	| 'created'
	| 'customer_email'
	| 'expires_at'
	| 'livemode'
	| 'metadata'
	| 'payment_method_types'
	| 'success_url'
	| 'url'
> & {
	amount_subtotal: number;
	amount_total: number;
	currency: string;
	customer: null;
	customer_details: Stripe.Checkout.Session.CustomerDetails | null;
	metadata: Metadata;
	mode: Extract<Stripe.Checkout.Session.Mode, 'payment'>;
	payment_intent: string | null;
	payment_status: Extract<Stripe.Checkout.Session.PaymentStatus, 'unpaid' | 'paid'>;
	status: Extract<Stripe.Checkout.Session.Status, 'open' | 'complete' | 'expired'>;
	success_url: string;
	ui_mode: Extract<Stripe.Checkout.Session.UiMode, 'hosted_page'>;
};

export type PaymentIntent = Pick<
	Stripe.PaymentIntent,
	| 'id'
	| 'object'
	| 'amount'
	| 'amount_capturable'
	| 'amount_received'
	| 'created'
	| 'currency'
	| 'description'
	| 'livemode'
	| 'payment_method_types'
	| 'receipt_email'
> & {
	capture_method: Extract<Stripe.PaymentIntent.CaptureMethod, 'automatic'>;
	client_secret: string;
	last_payment_error: Pick<
		Stripe.PaymentIntent.LastPaymentError,
		'type' | 'code' | 'decline_code' | 'message'
	> | null;
	latest_charge: string | null;
	metadata: Metadata;
	payment_method: string | null;
	status: Extract<Stripe.PaymentIntent.Status, 'requires_payment_method' | 'succeeded'>;
};

export type Refund = Pick<
	Stripe.Refund,
	'id' | 'object' | 'amount' | 'created' | 'currency' | 'reason'
> & {
	charge: string;
	metadata: Metadata;
	payment_intent: string;
	status: 'succeeded';
};

/** The charge as a `charge.refunded` event carries it. */
export type Charge = Pick<
	Stripe.Charge,
	| 'id'
	| 'object'
	| 'amount'
	| 'amount_captured'
	| 'amount_refunded'
	| 'captured'
	| 'created'
	| 'currency'
	| 'livemode'
	| 'metadata'
	| 'paid'
	| 'receipt_email'
	| 'refunded'
> & { payment_intent: string; status: Extract<Stripe.Charge.Status, 'succeeded'> };

/** The events the stand-in sends, each with the object the SDK's type says it carries. */
export type EventObjects = {
	'checkout.session.completed': Session;
	'checkout.session.expired': Session;
	'charge.refunded': Charge;
	'refund.updated': Refund;
};
export type EventType = keyof EventObjects & Stripe.Event.Type;

export type StandInEvent = Pick<
	Stripe.Event,
	'id' | 'object' | 'api_version' | 'created' | 'livemode' | 'pending_webhooks' | 'request'
> & { type: EventType; data: { object: EventObjects[EventType] } };

/** The object the SDK's event of that type carries. */
export type SdkEventObject<T extends EventType> = Extract<
	Stripe.Event,
	{ type: T }
>['data']['object'];

export type Delivery = {
	event: StandInEvent;
	url: string;
	delivered: boolean;
	attempts: { at: string; status?: number; error?: string }[];
};

export class State {
	sessions = new Map<string, Session>();
	lineItems = new Map<string, LineItem[]>();
	/** payment_intent_data given at session creation, used when the intent is made. */
	intentData = new Map<
		string,
		{
			metadata: Metadata;
			description: string | null;
			receipt_email: string | null;
		}
	>();
	paymentIntents = new Map<string, PaymentIntent>();
	refunds = new Map<string, Refund>();
	events = new Map<string, StandInEvent>();
	deliveries: Delivery[] = [];
	/** Seconds added to the real clock (tests move time forward to expire sessions). */
	clockOffset = 0;

	now() {
		return Math.floor(Date.now() / 1000) + this.clockOffset;
	}

	refundedOn(paymentIntentId: string) {
		let sum = 0;
		for (const r of this.refunds.values())
			if (r.payment_intent === paymentIntentId) sum += r.amount;
		return sum;
	}
}
