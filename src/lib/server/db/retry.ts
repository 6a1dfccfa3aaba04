import { db, type Tx } from './index';

/** InnoDB gives these when two transactions wait on each other; trying again is the cure. */
const RETRYABLE = new Set([1213, 1205]); // ER_LOCK_DEADLOCK, ER_LOCK_WAIT_TIMEOUT

export function isRetryable(err: unknown): boolean {
	const e = err as { errno?: number; cause?: { errno?: number } } | null;
	return RETRYABLE.has(e?.errno ?? -1) || RETRYABLE.has(e?.cause?.errno ?? -1);
}

/** Duplicate key (1062, ER_DUP_ENTRY): another request stored the same row first. Drizzle and
 * mysql2 wrap errors, so the whole `cause` chain is read. */
export function isDuplicateKey(err: unknown): boolean {
	for (let e = err; e && typeof e === 'object'; e = (e as { cause?: unknown }).cause) {
		const { errno, code } = e as { errno?: number; code?: string };
		if (errno === 1062 || code === 'ER_DUP_ENTRY') return true;
	}
	return false;
}

/**
 * Runs `run` again (a few times, with a short random pause) when InnoDB picks it as a deadlock
 * victim or a lock wait times out. `run` must be one whole transaction, which was rolled back,
 * so running it again is safe.
 */
async function withRetry<T>(run: () => Promise<T>, attempts = 5): Promise<T> {
	for (let i = 1; ; i++) {
		try {
			return await run();
		} catch (err) {
			if (i >= attempts || !isRetryable(err)) throw err;
			await new Promise((r) => setTimeout(r, 10 + Math.random() * 40 * i));
		}
	}
}

/** One transaction, retried on deadlock or lock-wait timeout. */
export function transact<T>(work: (tx: Tx) => Promise<T>, attempts = 5): Promise<T> {
	return withRetry(() => db.transaction(work), attempts);
}

/** Uses the caller's transaction when there is one, or opens a retried one. */
export function inTx<T>(tx: Tx | undefined, work: (tx: Tx) => Promise<T>): Promise<T> {
	return tx ? work(tx) : transact(work);
}
