import { ApiError, invalid, missing, noSuch } from './errors';
import type { Form } from './form';
import { newId } from './ids';
import * as p from './params';
import type { LineItem, PaymentIntent, Session, State } from './state';

const KNOWN = [
	'line_items',
	'mode',
	'metadata',
	'customer_email',
	'success_url',
	'cancel_url',
	'expires_at',
	'payment_intent_data',
	'client_reference_id',
	'payment_method_types',
	'locale',
	'submit_type',
	'billing_address_collection',
	'currency',
	'expand',
	'ui_mode'
];
const HOSTED: Session['ui_mode'] = 'hosted_page';
const MIN_LIFETIME = 30 * 60;
const MAX_LIFETIME = 24 * 60 * 60;

function lineItem(raw: unknown, i: number): LineItem {
	const at = `line_items[${i}]`;
	const li = p.obj(raw as Form, at) ?? {};
	// The error echoes what was sent, as Stripe does; a nested value showing as [object Object] is fine.
	// eslint-disable-next-line @typescript-eslint/no-base-to-string
	if (li.price !== undefined) throw noSuch('price', String(li.price), `${at}[price]`);
	const pd = p.obj(li.price_data, `${at}[price_data]`);
	if (!pd) throw missing(`${at}[price_data]`);
	const currency = p.currency(pd.currency, `${at}[price_data][currency]`);
	const unit = p.int(pd.unit_amount, `${at}[price_data][unit_amount]`, true);
	if (unit < 0 || unit > 99_999_999)
		throw invalid(`${at}[price_data][unit_amount]`, 'This value must be between 0 and 99999999.');
	const product = p.obj(pd.product_data, `${at}[price_data][product_data]`);
	if (!product) throw missing(`${at}[price_data][product_data]`);
	const name = p.str(product.name, `${at}[price_data][product_data][name]`, true);
	const quantity = p.int(li.quantity, `${at}[quantity]`, true);
	if (quantity < 1 || quantity > 999_999)
		throw invalid(`${at}[quantity]`, 'Quantity must be between 1 and 999999.');
	return {
		id: newId('li'),
		object: 'item',
		amount_discount: 0,
		amount_subtotal: unit * quantity,
		amount_tax: 0,
		amount_total: unit * quantity,
		currency,
		description: name,
		quantity,
		price: {
			id: newId('price'),
			object: 'price',
			active: false,
			currency,
			product: newId('prod', 14),
			type: 'one_time',
			unit_amount: unit,
			unit_amount_decimal: String(unit),
			livemode: false
		}
	};
}

/** POST /v1/checkout/sessions with price_data line items (the only kind the app sends). */
export function createSession(state: State, form: Form, payUrl: (id: string) => string): Session {
	p.onlyKnown(form, KNOWN);
	const mode = p.str(form.mode, 'mode', true);
	if (mode !== 'payment')
		throw invalid('mode', `This stand-in only supports mode=payment, not ${mode}.`);
	const uiMode = p.str(form.ui_mode, 'ui_mode');
	// The hosted page is `hosted_page` in the API version the pinned SDK speaks.
	if (uiMode && uiMode !== HOSTED)
		throw invalid('ui_mode', 'This stand-in only supports the hosted payment page.');

	const rawItems = p.list(form.line_items, 'line_items');
	if (!rawItems?.length) throw missing('line_items');
	if (rawItems.length > 100)
		throw invalid('line_items', 'A session can have at most 100 line items.');
	const items = rawItems.map(lineItem);
	const currency = items[0].currency;
	items.forEach((li, i) => {
		if (li.currency !== currency)
			throw invalid(
				`line_items[${i}][price_data][currency]`,
				'All line items must use the same currency.'
			);
	});

	const now = state.now();
	const expiresAt = p.int(form.expires_at, 'expires_at') ?? now + MAX_LIFETIME;
	if (expiresAt < now + MIN_LIFETIME)
		throw invalid(
			'expires_at',
			'The `expires_at` timestamp must be at least 30 minutes after the session is created.'
		);
	if (expiresAt > now + MAX_LIFETIME)
		throw invalid(
			'expires_at',
			'The `expires_at` timestamp must be less than 24 hours after the session is created.'
		);

	const email = p.str(form.customer_email, 'customer_email');
	if (email && !/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(email))
		throw invalid('customer_email', 'Invalid email address: ' + email, 'email_invalid');
	const clientRef = p.str(form.client_reference_id, 'client_reference_id') ?? null;
	if (clientRef && clientRef.length > 200)
		throw invalid('client_reference_id', 'client_reference_id can be at most 200 characters.');

	const pid = p.obj(form.payment_intent_data, 'payment_intent_data') ?? {};
	p.onlyKnown(pid, ['metadata', 'description', 'receipt_email', 'capture_method']);
	if (pid.capture_method !== undefined && pid.capture_method !== 'automatic')
		throw invalid(
			'payment_intent_data[capture_method]',
			'This stand-in only supports automatic capture.'
		);

	const total = items.reduce((s, li) => s + li.amount_total, 0);
	const id = newId('cs_test', 58);
	const session: Session = {
		id,
		object: 'checkout.session',
		amount_subtotal: total,
		amount_total: total,
		cancel_url: p.url(form.cancel_url, 'cancel_url', false),
		client_reference_id: clientRef,
		created: now,
		currency,
		customer: null,
		customer_details: null,
		customer_email: email ?? null,
		expires_at: expiresAt,
		livemode: false,
		metadata: p.metadata(form.metadata, 'metadata'),
		mode: 'payment',
		payment_intent: null,
		payment_method_types: ['card'],
		payment_status: 'unpaid',
		status: 'open',
		success_url: p.url(form.success_url, 'success_url', true)!,
		url: payUrl(id),
		ui_mode: HOSTED
	};
	state.sessions.set(id, session);
	state.lineItems.set(id, items);
	state.intentData.set(id, {
		metadata: p.metadata(pid.metadata, 'payment_intent_data[metadata]'),
		description: p.str(pid.description, 'payment_intent_data[description]') ?? null,
		receipt_email: p.str(pid.receipt_email, 'payment_intent_data[receipt_email]') ?? null
	});
	return session;
}

export function getSession(state: State, id: string) {
	const s = state.sessions.get(id);
	if (!s) throw noSuch('checkout.session', id);
	return s;
}

/** Expires an open session; returns it, or throws like the API for any other status. */
export function expireSession(state: State, id: string) {
	const s = getSession(state, id);
	if (s.status !== 'open')
		throw new ApiError(
			400,
			'invalid_request_error',
			'Only Checkout Sessions with a status in ["open"] can be expired.',
			'checkout_session_not_open'
		);
	s.status = 'expired';
	s.url = null;
	return s;
}

function intentFor(state: State, s: Session): PaymentIntent {
	if (s.payment_intent) return state.paymentIntents.get(s.payment_intent)!;
	const extra = state.intentData.get(s.id)!;
	const pi: PaymentIntent = {
		id: newId('pi'),
		object: 'payment_intent',
		amount: s.amount_total,
		amount_capturable: 0,
		amount_received: 0,
		capture_method: 'automatic',
		client_secret: '',
		created: state.now(),
		currency: s.currency,
		description: extra.description,
		last_payment_error: null,
		latest_charge: null,
		livemode: false,
		metadata: extra.metadata,
		payment_method: null,
		payment_method_types: ['card'],
		receipt_email: extra.receipt_email ?? s.customer_email,
		status: 'requires_payment_method'
	};
	pi.client_secret = `${pi.id}_secret_${newId('x', 24).slice(2)}`;
	state.paymentIntents.set(pi.id, pi);
	s.payment_intent = pi.id;
	return pi;
}

/** A declined attempt: the session stays open and its payment intent records the error. */
export function declineSession(
	state: State,
	s: Session,
	decline: { code: string; decline_code: string; message: string }
) {
	const pi = intentFor(state, s);
	pi.last_payment_error = { type: 'card_error', ...decline };
	pi.payment_method = newId('pm');
}

/** A successful payment: session complete and paid, payment intent succeeded with a charge. */
export function completeSession(state: State, s: Session, buyer: { name: string }) {
	const pi = intentFor(state, s);
	pi.status = 'succeeded';
	pi.amount_received = pi.amount;
	pi.last_payment_error = null;
	pi.latest_charge = newId('ch');
	pi.payment_method = newId('pm');
	s.status = 'complete';
	s.payment_status = 'paid';
	s.url = null;
	s.customer_details = {
		address: null,
		business_name: null,
		email: s.customer_email,
		individual_name: null,
		name: buyer.name,
		phone: null,
		tax_exempt: 'none',
		tax_ids: []
	};
	return pi;
}

/** Open sessions whose expires_at has passed. */
export function dueToExpire(state: State) {
	const now = state.now();
	return [...state.sessions.values()].filter((s) => s.status === 'open' && s.expires_at <= now);
}
