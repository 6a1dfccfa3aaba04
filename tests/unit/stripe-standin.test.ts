import http from 'node:http';
import Stripe from 'stripe';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { startStripeServer } from '../../mocks/stripe/server';
import type { Delivery } from '../../mocks/stripe/state';
import { DomainError } from '$lib/server/errors/domain-error';

// Round trips through the official `stripe` SDK against the running stand-in on a random port.
const SECRET_KEY = 'sk_test_roundtrip';
const WEBHOOK_SECRET = 'whsec_roundtrip';

type Received = { body: string; signature: string };
let received: Received[] = [];
let failNext = 0;
const receiver = http.createServer((req, res) => {
	let body = '';
	req.on('data', (c) => (body += c));
	req.on('end', () => {
		if (failNext > 0) {
			failNext--;
			res.writeHead(500).end('not yet');
			return;
		}
		received.push({ body, signature: String(req.headers['stripe-signature']) });
		res.writeHead(200).end('{}');
	});
});

let standIn: Awaited<ReturnType<typeof startStripeServer>>;
let sdk: Stripe;
let payments: typeof import('$lib/server/orders/stripe');

beforeAll(async () => {
	await new Promise<void>((r) => receiver.listen(0, '127.0.0.1', r));
	const hook = `http://127.0.0.1:${(receiver.address() as { port: number }).port}/api/payments/webhook`;
	standIn = await startStripeServer({
		port: 0,
		secretKey: SECRET_KEY,
		webhookSecret: WEBHOOK_SECRET,
		webhookUrl: hook,
		retryBaseMs: 40,
		maxAttempts: 4
	});
	// The app's payments module reads config lazily: point it at this stand-in.
	Object.assign(process.env, {
		STRIPE_SECRET_KEY: SECRET_KEY,
		STRIPE_WEBHOOK_SECRET: WEBHOOK_SECRET,
		STRIPE_API_HOST: '127.0.0.1',
		STRIPE_API_PORT: String(standIn.port),
		STRIPE_API_PROTOCOL: 'http'
	});
	payments = await import('$lib/server/orders/stripe');
	sdk = payments.stripe();
});

afterAll(async () => {
	await standIn.close();
	await new Promise((r) => receiver.close(r));
});

beforeEach(() => {
	received = [];
	failNext = 0;
});

const waitFor = async <T>(fn: () => T | undefined, ms = 3000): Promise<T> => {
	const end = Date.now() + ms;
	for (;;) {
		const v = fn();
		if (v) return v;
		if (Date.now() > end) throw new Error('timed out waiting');
		await new Promise((r) => setTimeout(r, 20));
	}
};

const newSession = (extra: Partial<Stripe.Checkout.SessionCreateParams> = {}) =>
	sdk.checkout.sessions.create({
		mode: 'payment',
		line_items: [
			{
				quantity: 2,
				price_data: {
					currency: 'usd',
					unit_amount: 4500,
					product_data: {
						name: 'Rosette plate, cherry',
						description: 'Initials H M'
					}
				}
			},
			{
				quantity: 1,
				price_data: {
					currency: 'usd',
					unit_amount: 1250,
					product_data: { name: 'Shipping' }
				}
			}
		],
		metadata: { order_ref: 'LF-1042' },
		customer_email: 'ada.buyer@example.test',
		success_url: 'http://localhost:3000/checkout/done?session_id={CHECKOUT_SESSION_ID}',
		cancel_url: 'http://localhost:3000/cart?cancelled=1',
		payment_intent_data: { metadata: { order_ref: 'LF-1042' } },
		...extra
	});

const pay = (url: string, card: Record<string, string>) =>
	fetch(url, {
		method: 'POST',
		body: new URLSearchParams(card),
		redirect: 'manual'
	});

const goodCard = {
	number: '4242 4242 4242 4242',
	expiry: '12/39',
	cvc: '123',
	name: 'Ada Buyer'
};

describe('Stripe stand-in with the official SDK', () => {
	it('creates and retrieves a Checkout Session with price_data line items', async () => {
		const s = await newSession();
		expect(s.id).toMatch(/^cs_test_/);
		expect(s.object).toBe('checkout.session');
		expect(s.amount_total).toBe(2 * 4500 + 1250);
		expect(s.currency).toBe('usd');
		expect(s.status).toBe('open');
		expect(s.payment_status).toBe('unpaid');
		expect(s.metadata).toEqual({ order_ref: 'LF-1042' });
		expect(s.url).toBe(`${standIn.origin}/pay/${s.id}`);
		expect(s.expires_at - s.created).toBe(24 * 3600);
		// The hosted page as the SDK's API version names it (Stripe.Checkout.Session.UiMode).
		expect(s.ui_mode).toBe('hosted_page');

		const again = await sdk.checkout.sessions.retrieve(s.id, {
			expand: ['line_items']
		});
		expect(again.customer_email).toBe('ada.buyer@example.test');
		expect(
			again.line_items!.data.map((li) => [li.description, li.quantity, li.amount_total])
		).toEqual([
			['Rosette plate, cherry', 2, 9000],
			['Shipping', 1, 1250]
		]);
		const items = await sdk.checkout.sessions.listLineItems(s.id);
		expect(items.data).toHaveLength(2);

		const page = await (await fetch(s.url!)).text();
		expect(page).toContain('$102.50');
		expect(page).toContain('Rosette plate, cherry');
		expect(page).toContain('Cancel and go back');
	});

	it('pays with 4242…: session complete, intent succeeded, redirect, signed webhook verified', async () => {
		const s = await newSession();
		const res = await pay(s.url!, goodCard);
		expect(res.status).toBe(303);
		expect(res.headers.get('location')).toBe(
			`http://localhost:3000/checkout/done?session_id=${s.id}`
		);

		const done = await sdk.checkout.sessions.retrieve(s.id);
		expect(done.status).toBe('complete');
		expect(done.payment_status).toBe('paid');
		expect(done.url).toBeNull();
		const pi = await sdk.paymentIntents.retrieve(done.payment_intent as string);
		expect(pi.id).toMatch(/^pi_/);
		expect(pi.status).toBe('succeeded');
		expect(pi.amount).toBe(10250);
		expect(pi.amount_received).toBe(10250);
		expect(pi.metadata).toEqual({ order_ref: 'LF-1042' });

		const hit = await waitFor(() => received[0]);
		expect(hit.signature).toMatch(/^t=\d+,v1=[0-9a-f]{64}$/);
		// Reference verifier: the official SDK, through the app's own verifyWebhook.
		const event = payments.verifyWebhook(hit.body, hit.signature);
		expect(event.type).toBe('checkout.session.completed');
		expect(event.id).toMatch(/^evt_/);
		expect(event.livemode).toBe(false);
		// The events speak the API version of the SDK whose types mocks/stripe/state.ts uses.
		expect(event.api_version).toBe(Stripe.API_VERSION);
		const obj = event.data.object as Stripe.Checkout.Session;
		// Every field of the SDK's CustomerDetails (this API version's), as the real service sends.
		expect(Object.keys(obj.customer_details!).sort()).toEqual([
			'address',
			'business_name',
			'email',
			'individual_name',
			'name',
			'phone',
			'tax_exempt',
			'tax_ids'
		]);
		expect(obj.customer_details!.name).toBe(goodCard.name);
		expect(obj.id).toBe(s.id);
		expect(obj.payment_status).toBe('paid');
		expect(obj.metadata).toEqual({ order_ref: 'LF-1042' });
		expect(() => payments.verifyWebhook(hit.body.replace('paid', 'unpaid'), hit.signature)).toThrow(
			/^The signature was not accepted: /
		);
		expect(() => payments.verifyWebhook(hit.body, null)).toThrow(DomainError);

		// Paying twice is not possible; the page says it is already paid.
		const second = await pay(s.url!, goodCard);
		expect(second.status).toBe(200);
		expect(await second.text()).toContain('already paid');
	});

	it('retries a failed webhook delivery with backoff until it is accepted', async () => {
		failNext = 2;
		const s = await newSession();
		expect((await pay(s.url!, goodCard)).status).toBe(303);
		await waitFor(() => received[0]);
		const log = (await (await fetch(`${standIn.origin}/_mock/events`)).json()) as Delivery[];
		const d = log.find((x) => (x.event.data.object as { id: string }).id === s.id)!;
		expect(d.delivered).toBe(true);
		expect(d.attempts.map((a) => a.status)).toEqual([500, 500, 200]);
		const gap1 = Date.parse(d.attempts[1].at) - Date.parse(d.attempts[0].at);
		const gap2 = Date.parse(d.attempts[2].at) - Date.parse(d.attempts[1].at);
		expect(gap1).toBeGreaterThanOrEqual(35);
		expect(gap2).toBeGreaterThanOrEqual(75); // doubled
	});

	it('declined card 4000 0000 0000 0002 leaves the session open and unpaid', async () => {
		const s = await newSession();
		const res = await pay(s.url!, {
			...goodCard,
			number: '4000 0000 0000 0002'
		});
		expect(res.status).toBe(402);
		const page = await res.text();
		expect(page).toContain('Your card was declined.');
		expect(page).toContain('href="http://localhost:3000/cart?cancelled=1"');

		const after = await sdk.checkout.sessions.retrieve(s.id);
		expect(after.status).toBe('open');
		expect(after.payment_status).toBe('unpaid');
		const pi = await sdk.paymentIntents.retrieve(after.payment_intent as string);
		expect(pi.status).toBe('requires_payment_method');
		expect(pi.last_payment_error?.decline_code).toBe('generic_decline');
		await new Promise((r) => setTimeout(r, 100));
		expect(received).toHaveLength(0);

		// The buyer can try again with a good card.
		expect((await pay(s.url!, goodCard)).status).toBe(303);
		expect((await sdk.paymentIntents.retrieve(after.payment_intent as string)).status).toBe(
			'succeeded'
		);
	});

	it('gives field messages for a bad card number, past expiry and bad security code', async () => {
		const s = await newSession();
		const res = await pay(s.url!, {
			number: '4242 4242 4242 4241',
			expiry: '01/20',
			cvc: '12',
			name: ''
		});
		expect(res.status).toBe(400);
		const page = await res.text();
		expect(page).toContain('That card number is not valid');
		expect(page).toContain('That expiry date is in the past.');
		expect(page).toContain('The security code is 3 digits.');
		expect(page).toContain('Enter the name on the card.');
		expect(page).toContain('value="4242 4242 4242 4241"');
		const bad = await pay(s.url!, { ...goodCard, expiry: '13/30' });
		expect(await bad.text()).toContain('MM/YY');
		expect((await sdk.checkout.sessions.retrieve(s.id)).payment_status).toBe('unpaid');
	});

	it('refunds in part and in full, and refuses to refund more than was paid', async () => {
		const s = await newSession();
		await pay(s.url!, goodCard);
		const piId = (await sdk.checkout.sessions.retrieve(s.id)).payment_intent as string;

		const part = await sdk.refunds.create({
			payment_intent: piId,
			amount: 3000
		});
		expect(part).toMatchObject({
			object: 'refund',
			amount: 3000,
			currency: 'usd',
			status: 'succeeded',
			payment_intent: piId
		});
		expect((await sdk.refunds.retrieve(part.id)).amount).toBe(3000);

		const over = sdk.refunds.create({ payment_intent: piId, amount: 7251 });
		await expect(over).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
		await expect(over).rejects.toMatchObject({
			code: 'amount_too_large',
			param: 'amount',
			statusCode: 400
		});

		const rest = await sdk.refunds.create({ payment_intent: piId });
		expect(rest.amount).toBe(10250 - 3000);
		await expect(sdk.refunds.create({ payment_intent: piId, amount: 1 })).rejects.toMatchObject({
			code: 'charge_already_refunded'
		});
		await expect(sdk.refunds.retrieve('re_missing')).rejects.toMatchObject({
			statusCode: 404,
			code: 'resource_missing'
		});

		const unpaid = await newSession();
		await expect(sdk.refunds.create({ payment_intent: 'pi_nope' })).rejects.toMatchObject({
			code: 'resource_missing'
		});
		expect(unpaid.payment_intent).toBeNull();
	});

	it('sends charge.refunded and refund.updated for each refund, signed like the real service', async () => {
		const s = await newSession();
		await pay(s.url!, goodCard);
		const piId = (await sdk.checkout.sessions.retrieve(s.id)).payment_intent as string;
		await waitFor(() => received.find((r) => r.body.includes('checkout.session.completed')));
		received = [];

		const part = await sdk.refunds.create({ payment_intent: piId, amount: 2500 });
		await waitFor(() => (received.length >= 2 ? received : undefined));
		// The SDK's own verifier is the outside reference for the signature scheme.
		const events = received.map((r) =>
			sdk.webhooks.constructEvent(r.body, r.signature, WEBHOOK_SECRET)
		);
		const charge = events.find((e) => e.type === 'charge.refunded')!.data.object;
		expect(charge).toMatchObject({
			object: 'charge',
			payment_intent: piId,
			amount: 10250,
			amount_refunded: 2500,
			refunded: false
		});
		const updated = events.find((e) => e.type === 'refund.updated')!.data.object;
		expect(updated).toMatchObject({ id: part.id, amount: 2500, status: 'succeeded' });

		received = [];
		await sdk.refunds.create({ payment_intent: piId });
		await waitFor(() => (received.length >= 2 ? received : undefined));
		const full = received
			.map((r) => sdk.webhooks.constructEvent(r.body, r.signature, WEBHOOK_SECRET))
			.find((e) => e.type === 'charge.refunded')!.data.object;
		expect(full).toMatchObject({ amount_refunded: 10250, refunded: true });
	});

	it('expires a session via the API and when its expires_at passes, sending checkout.session.expired', async () => {
		const a = await newSession();
		const expired = await sdk.checkout.sessions.expire(a.id);
		expect(expired.status).toBe('expired');
		expect(expired.url).toBeNull();
		await expect(sdk.checkout.sessions.expire(a.id)).rejects.toBeInstanceOf(
			Stripe.errors.StripeInvalidRequestError
		);
		expect((await fetch(`${standIn.origin}/pay/${a.id}`)).status).toBe(410);

		const now = Math.floor(Date.now() / 1000);
		const b = await newSession({ expires_at: now + 1800 });
		await expect(newSession({ expires_at: now + 60 })).rejects.toMatchObject({
			param: 'expires_at'
		});
		await fetch(`${standIn.origin}/_mock/advance?seconds=1801`, {
			method: 'POST'
		});
		expect((await sdk.checkout.sessions.retrieve(b.id)).status).toBe('expired');

		// Only the expiry events: a completion from an earlier test may still be arriving.
		const expiredEvents = () =>
			received
				.map((r) => payments.verifyWebhook(r.body, r.signature))
				.filter((e) => e.type === 'checkout.session.expired');
		const events = await waitFor(() => (expiredEvents().length >= 2 ? expiredEvents() : undefined));
		expect(events.map((e) => [e.type, (e.data.object as { id: string }).id]).sort()).toEqual(
			[
				['checkout.session.expired', a.id],
				['checkout.session.expired', b.id]
			].sort()
		);
	});

	it('answers bad requests with Stripe-shaped errors', async () => {
		await expect(
			sdk.checkout.sessions.create({
				mode: 'payment',
				success_url: 'http://localhost:3000/ok'
			})
		).rejects.toMatchObject({
			type: 'StripeInvalidRequestError',
			param: 'line_items',
			code: 'parameter_missing'
		});
		await expect(
			newSession({
				line_items: [
					{
						quantity: 1,
						price_data: {
							currency: 'usd',
							unit_amount: 'abc' as unknown as number,
							product_data: { name: 'x' }
						}
					}
				]
			})
		).rejects.toMatchObject({
			code: 'parameter_invalid_integer',
			param: 'line_items[0][price_data][unit_amount]'
		});
		await expect(sdk.checkout.sessions.retrieve('cs_test_missing')).rejects.toMatchObject({
			statusCode: 404
		});
		await expect(sdk.paymentIntents.retrieve('pi_missing')).rejects.toBeInstanceOf(
			Stripe.errors.StripeInvalidRequestError
		);

		const raw = await fetch(`${standIn.origin}/v1/checkout/sessions`, {
			method: 'POST',
			headers: {
				authorization: `Bearer ${SECRET_KEY}`,
				'content-type': 'application/x-www-form-urlencoded'
			},
			body: 'mode=payment&colour=red'
		});
		expect(raw.status).toBe(400);
		expect(await raw.json()).toEqual({
			error: {
				type: 'invalid_request_error',
				code: 'parameter_unknown',
				message: 'Received unknown parameter: colour',
				param: 'colour'
			}
		});
	});

	it('rejects a wrong secret key with StripeAuthenticationError (401)', async () => {
		const wrong = new Stripe('sk_test_wrong', {
			host: '127.0.0.1',
			port: standIn.port,
			protocol: 'http'
		});
		const err: unknown = await wrong.checkout.sessions
			.retrieve('cs_test_x')
			.catch((e: unknown) => e);
		expect(err).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
		expect((err as { statusCode?: number }).statusCode).toBe(401);
		const none = await fetch(`${standIn.origin}/v1/refunds/re_x`);
		expect(none.status).toBe(401);
	});

	it('replays an idempotent create and refuses the same key with other parameters', async () => {
		const params = (quantity: number): Stripe.Checkout.SessionCreateParams => ({
			mode: 'payment',
			success_url: 'http://localhost:3000/ok',
			line_items: [
				{
					quantity,
					price_data: {
						currency: 'eur',
						unit_amount: 900,
						product_data: { name: 'Ornament' }
					}
				}
			]
		});
		const first = await sdk.checkout.sessions.create(params(1), {
			idempotencyKey: 'order-LF-7'
		});
		const replay = await sdk.checkout.sessions.create(params(1), {
			idempotencyKey: 'order-LF-7'
		});
		expect(replay.id).toBe(first.id);
		const other = await sdk.checkout.sessions.create(params(1), {
			idempotencyKey: 'order-LF-8'
		});
		expect(other.id).not.toBe(first.id);
		await expect(
			sdk.checkout.sessions.create(params(2), { idempotencyKey: 'order-LF-7' })
		).rejects.toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
	});
});
