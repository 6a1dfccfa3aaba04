import { newId } from './ids';
import { signatureHeader } from './signature';
import type {
	Delivery,
	EventObjects,
	EventType,
	SdkEventObject,
	StandInEvent,
	State
} from './state';

export type WebhookOptions = {
	url: string;
	secret: string;
	/** The SDK's own (`Stripe.API_VERSION`): the version whose types the objects are checked against. */
	apiVersion: string;
	/** First retry delay; each later one doubles (0.5 s, 1 s, 2 s, …). */
	retryBaseMs: number;
	maxAttempts: number;
};

/**
 * Sends events to the app's webhook endpoint, signed per attempt with a fresh timestamp as Stripe
 * does, retrying with doubling delays on a non-2xx answer or a connection error. Never blocks the
 * caller: the payment page redirects while delivery goes on in the background.
 */
export class Webhooks {
	private timers = new Set<NodeJS.Timeout>();
	private closed = false;

	constructor(
		private state: State,
		private opts: WebhookOptions
	) {}

	/** `object` must be a part of what the SDK's event of that type carries, field for field. */
	send<T extends EventType>(
		type: T,
		object: EventObjects[T] & Partial<SdkEventObject<T>>
	): StandInEvent {
		const event: StandInEvent = {
			id: newId('evt'),
			object: 'event',
			api_version: this.opts.apiVersion,
			created: this.state.now(),
			// A snapshot: later changes to the object must not change an event already sent.
			data: { object: structuredClone(object) },
			livemode: false,
			pending_webhooks: 1,
			request: { id: null, idempotency_key: null },
			type
		};
		this.state.events.set(event.id, event);
		const delivery: Delivery = {
			event,
			url: this.opts.url,
			delivered: false,
			attempts: []
		};
		this.state.deliveries.push(delivery);
		void this.attempt(delivery, JSON.stringify(event, null, 2));
		return event;
	}

	private async attempt(d: Delivery, payload: string) {
		if (this.closed) return;
		const record: Delivery['attempts'][number] = {
			at: new Date().toISOString()
		};
		d.attempts.push(record);
		try {
			const res = await fetch(d.url, {
				method: 'POST',
				headers: {
					'content-type': 'application/json; charset=utf-8',
					'user-agent': 'chipstall-stripe-stand-in',
					'stripe-signature': signatureHeader(payload, this.opts.secret)
				},
				body: payload,
				signal: AbortSignal.timeout(10_000)
			});
			record.status = res.status;
			await res.arrayBuffer().catch(() => undefined);
			if (res.ok) {
				d.delivered = true;
				d.event.pending_webhooks = 0;
				return;
			}
		} catch (err) {
			// fetch hides the socket error (ECONNREFUSED …) in `cause`.
			const cause = (err as { cause?: { message?: string } }).cause;
			record.error = cause?.message ?? (err as Error).message;
		}
		if (d.attempts.length >= this.opts.maxAttempts || this.closed) return;
		const delay = this.opts.retryBaseMs * 2 ** (d.attempts.length - 1);
		const t = setTimeout(() => {
			this.timers.delete(t);
			void this.attempt(d, payload);
		}, delay);
		this.timers.add(t);
	}

	close() {
		this.closed = true;
		for (const t of this.timers) clearTimeout(t);
		this.timers.clear();
	}
}
