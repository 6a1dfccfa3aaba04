import { ApiError, invalid, noSuch } from './errors';
import type { Form } from './form';
import * as p from './params';
import { chargeAfterRefund, createRefund, getRefund } from './refunds';
import { createSession, expireSession, getSession } from './sessions';
import type { Session, State } from './state';
import type { Webhooks } from './webhooks';

export type ApiContext = {
	state: State;
	webhooks: Webhooks;
	payUrl: (id: string) => string;
};
type Handler = (ctx: ApiContext, form: Form, m: RegExpMatchArray) => unknown;

function expandList(form: Form): string[] {
	const e = p.list(form.expand, 'expand') ?? [];
	return e.map((x, i) => p.str(x, `expand[${i}]`, true));
}

/** Copies a session with the `expand[]` fields the caller asked for filled in. */
function withExpand(ctx: ApiContext, s: Session, form: Form) {
	const out: Record<string, unknown> = { ...s };
	for (const field of expandList(form)) {
		if (field === 'line_items') out.line_items = lineItemList(ctx, s.id);
		else if (field === 'payment_intent')
			out.payment_intent = s.payment_intent ? ctx.state.paymentIntents.get(s.payment_intent) : null;
		else throw invalid('expand', `This property cannot be expanded (${field}).`);
	}
	return out;
}

function found<T>(x: T | undefined, kind: string, id: string): T {
	if (x === undefined) throw noSuch(kind, id);
	return x;
}

const lineItemList = (ctx: ApiContext, id: string) => ({
	object: 'list',
	data: ctx.state.lineItems.get(id) ?? [],
	has_more: false,
	url: `/v1/checkout/sessions/${id}/line_items`
});

/** The part of Stripe's REST API the app uses, as [method, path pattern, handler]. */
export const routes: [string, RegExp, Handler][] = [
	[
		'POST',
		/^\/v1\/checkout\/sessions$/,
		(ctx, form) => withExpand(ctx, createSession(ctx.state, form, ctx.payUrl), form)
	],
	[
		'GET',
		/^\/v1\/checkout\/sessions$/,
		(ctx, form) => {
			const pi = p.str(form.payment_intent, 'payment_intent');
			const limit = Math.min(Math.max(p.int(form.limit, 'limit') ?? 10, 1), 100);
			const all = [...ctx.state.sessions.values()]
				.filter((s) => !pi || s.payment_intent === pi)
				.reverse();
			return {
				object: 'list',
				data: all.slice(0, limit),
				has_more: all.length > limit,
				url: '/v1/checkout/sessions'
			};
		}
	],
	[
		'GET',
		/^\/v1\/checkout\/sessions\/([^/]+)$/,
		(ctx, form, m) => withExpand(ctx, getSession(ctx.state, m[1]), form)
	],
	[
		'GET',
		/^\/v1\/checkout\/sessions\/([^/]+)\/line_items$/,
		(ctx, _f, m) => (getSession(ctx.state, m[1]), lineItemList(ctx, m[1]))
	],
	[
		'POST',
		/^\/v1\/checkout\/sessions\/([^/]+)\/expire$/,
		(ctx, form, m) => {
			const s = expireSession(ctx.state, m[1]);
			ctx.webhooks.send('checkout.session.expired', s);
			return withExpand(ctx, s, form);
		}
	],
	[
		'GET',
		/^\/v1\/payment_intents\/([^/]+)$/,
		(ctx, _f, m) => found(ctx.state.paymentIntents.get(m[1]), 'payment_intent', m[1])
	],
	[
		'POST',
		/^\/v1\/refunds$/,
		(ctx, form) => {
			const refund = createRefund(ctx.state, form);
			// As the real service does once a card refund settles: the charge with its new refunded
			// total, then the refund itself with its final status. Both signed, both retried.
			ctx.webhooks.send('charge.refunded', chargeAfterRefund(ctx.state, refund));
			ctx.webhooks.send('refund.updated', refund);
			return refund;
		}
	],
	['GET', /^\/v1\/refunds\/([^/]+)$/, (ctx, _f, m) => getRefund(ctx.state, m[1])],
	[
		'GET',
		/^\/v1\/refunds$/,
		// The list, newest first, filtered by payment_intent when given (no paging: a test's few).
		(ctx, form) => {
			const pi = typeof form.payment_intent === 'string' ? form.payment_intent : undefined;
			const data = [...ctx.state.refunds.values()]
				.filter((r) => !pi || r.payment_intent === pi)
				.reverse();
			return { object: 'list', url: '/v1/refunds', has_more: false, data };
		}
	],
	[
		'GET',
		/^\/v1\/events\/([^/]+)$/,
		(ctx, _f, m) => found(ctx.state.events.get(m[1]), 'event', m[1])
	]
];

export function route(ctx: ApiContext, method: string, path: string, form: Form) {
	for (const [verb, pattern, handler] of routes) {
		const m = path.match(pattern);
		if (m && verb === method) return handler(ctx, form, m);
	}
	throw new ApiError(
		404,
		'invalid_request_error',
		`Unrecognized request URL (${method}: ${path}).`
	);
}
