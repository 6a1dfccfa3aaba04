import { ApiError } from './errors';

type Saved = { fingerprint: string; status: number; body: string };

/**
 * Stripe-style idempotent POSTs: a repeated Idempotency-Key with the same request replays the
 * saved answer; the same key with different parameters is refused. Only successful answers are
 * saved (requests that fail validation are not).
 */
export class IdempotencyStore {
	private saved = new Map<string, Saved>();

	lookup(key: string, fingerprint: string): Saved | undefined {
		const s = this.saved.get(key);
		if (s && s.fingerprint !== fingerprint)
			throw new ApiError(
				400,
				'idempotency_error',
				`Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`
			);
		return s;
	}

	save(key: string, saved: Saved) {
		this.saved.set(key, saved);
	}
}
