/**
 * Throttles with rate-limiter-flexible's MySQL store, on the app's own MariaDB.
 *
 * Why a shared store rather than a per-process counter (e.g. sveltekit-rate-limiter): the shop
 * may run as several `node build` processes behind one address, and a per-process limit would
 * let an attacker multiply their guesses by the number of processes. Counting in the database
 * gives one limit whatever serves the request. Once a key is over its limit it is also blocked
 * in memory (`inMemoryBlockOnConsumed`), so a flood costs no more database work; if the database
 * does not answer, an in-memory limiter stands in rather than letting everything through.
 * The `rate_limits` table comes from our Drizzle migrations (drizzle/), not created at run time.
 * Sources: OWASP ASVS 4.0 V2.2.1 (anti-automation on authentication), RFC 6585 §4 (429).
 */
import { createHash } from 'node:crypto';
import mysql from 'mysql2';
import { RateLimiterMemory, RateLimiterMySQL, RateLimiterRes } from 'rate-limiter-flexible';
import { config } from '../config';

/**
 * A small pool of the limiter's own (the store speaks mysql2's callback API). Kept apart from the
 * shop's pool: a flood on one key queues on that row's lock here, not in front of the shop's
 * queries. Created on first use; closed on shutdown so `node build` exits.
 */
let pool: mysql.Pool | undefined;
function limiterPool(): mysql.Pool {
	if (!pool) {
		pool = mysql.createPool({ uri: config.db.url, connectionLimit: 4 });
		process.once('sveltekit:shutdown', () => pool?.end());
	}
	return pool;
}

export type Policy = { prefix: string; points: number; durationS: number };

export type Verdict = { ok: true } | { ok: false; retryAfterS: number };

/** The database name the store writes to: from DATABASE_URL when set. */
function dbName(): string {
	try {
		return decodeURIComponent(new URL(config.db.url).pathname.slice(1)) || config.db.name;
	} catch {
		return config.db.name;
	}
}

export class Limiter {
	private store: RateLimiterMySQL;

	constructor(readonly policy: Policy) {
		const common = { keyPrefix: policy.prefix, points: policy.points, duration: policy.durationS };
		this.store = new RateLimiterMySQL({
			...common,
			storeClient: limiterPool(),
			storeType: 'pool',
			dbName: dbName(),
			tableName: 'rate_limits',
			tableCreated: true,
			inMemoryBlockOnConsumed: policy.points,
			inMemoryBlockDuration: Math.min(policy.durationS, 60),
			insuranceLimiter: new RateLimiterMemory(common)
		});
	}

	/** Counts one attempt; refused once `points` were used in the window. */
	async take(key: string): Promise<Verdict> {
		try {
			await this.store.consume(hashed(key));
			return { ok: true };
		} catch (res) {
			if (res instanceof RateLimiterRes) {
				return { ok: false, retryAfterS: Math.max(1, Math.ceil(res.msBeforeNext / 1000)) };
			}
			throw res;
		}
	}

	/** True when the key has used up its points in the window (counts nothing). */
	async isOver(key: string): Promise<boolean> {
		try {
			const res = await this.store.get(hashed(key));
			return res !== null && res.consumedPoints > this.policy.points;
		} catch {
			return false;
		}
	}

	/** Forgets a key's attempts (after a successful sign-in for that account). */
	async forget(key: string): Promise<void> {
		await this.store.delete(hashed(key)).catch(() => undefined);
	}
}

/** Keys are hashed: e-mail addresses are not kept in the table, and any key fits its column. */
function hashed(key: string): string {
	return createHash('sha256').update(key).digest('hex');
}

/** Takes one attempt from every limiter; the longest wait when any refuses. */
export async function takeAll(pairs: [Limiter, string][]): Promise<Verdict> {
	const verdicts = await Promise.all(pairs.map(([l, k]) => l.take(k)));
	const waits = verdicts.flatMap((v) => (v.ok ? [] : [v.retryAfterS]));
	return waits.length ? { ok: false, retryAfterS: Math.max(...waits) } : { ok: true };
}

/** "Try again in 14 minutes." — the plain sentence on a throttled form. */
export function tryAgainIn(seconds: number): string {
	if (seconds < 90) return `Too many tries. Please wait ${seconds} seconds and try again.`;
	return `Too many tries. Please wait ${Math.ceil(seconds / 60)} minutes and try again.`;
}
