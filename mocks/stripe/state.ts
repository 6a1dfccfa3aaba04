/** In-memory objects of the Stripe stand-in, kept for the life of the process. */
export type Metadata = Record<string, string>;

export type LineItem = {
	id: string;
	object: 'item';
	amount_discount: number;
	amount_subtotal: number;
	amount_tax: number;
	amount_total: number;
	currency: string;
	description: string;
	quantity: number;
	price: {
		id: string;
		object: 'price';
		active: boolean;
		currency: string;
		product: string;
		type: 'one_time';
		unit_amount: number;
		unit_amount_decimal: string;
		livemode: false;
	};
};

export type Session = {
	id: string;
	object: 'checkout.session';
	amount_subtotal: number;
	amount_total: number;
	cancel_url: string | null;
	client_reference_id: string | null;
	created: number;
	currency: string;
	customer: null;
	customer_details: { email: string | null; name: string | null } | null;
	customer_email: string | null;
	expires_at: number;
	livemode: false;
	metadata: Metadata;
	mode: 'payment';
	payment_intent: string | null;
	payment_method_types: string[];
	payment_status: 'unpaid' | 'paid';
	status: 'open' | 'complete' | 'expired';
	success_url: string;
	url: string | null;
	ui_mode: 'hosted';
};

export type PaymentIntent = {
	id: string;
	object: 'payment_intent';
	amount: number;
	amount_capturable: number;
	amount_received: number;
	capture_method: 'automatic';
	client_secret: string;
	created: number;
	currency: string;
	description: string | null;
	last_payment_error: null | {
		type: 'card_error';
		code: string;
		decline_code: string;
		message: string;
	};
	latest_charge: string | null;
	livemode: false;
	metadata: Metadata;
	payment_method: string | null;
	payment_method_types: string[];
	receipt_email: string | null;
	status: 'requires_payment_method' | 'succeeded';
};

export type Refund = {
	id: string;
	object: 'refund';
	amount: number;
	charge: string;
	created: number;
	currency: string;
	metadata: Metadata;
	payment_intent: string;
	reason: string | null;
	status: 'succeeded';
};

export type StandInEvent = {
	id: string;
	object: 'event';
	api_version: string;
	created: number;
	data: { object: unknown };
	livemode: false;
	pending_webhooks: number;
	request: { id: null; idempotency_key: null };
	type: string;
};

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
