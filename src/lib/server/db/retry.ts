/** MariaDB errors worth a second try: deadlock (1213) and lock-wait timeout (1205). */
const RETRYABLE = new Set([1213, 1205]);

export function isRetryable(err: unknown): boolean {
	const e = err as { errno?: number; cause?: { errno?: number } } | null;
	return RETRYABLE.has(e?.errno ?? -1) || RETRYABLE.has(e?.cause?.errno ?? -1);
}

/** Runs a transaction body again when the database chose it as a deadlock victim. */
export async function withRetry<T>(run: () => Promise<T>, tries = 4): Promise<T> {
	for (let attempt = 1; ; attempt++) {
		try {
			return await run();
		} catch (err) {
			if (attempt >= tries || !isRetryable(err)) throw err;
			await new Promise((r) => setTimeout(r, 15 * attempt + Math.random() * 20));
		}
	}
}

/** Duplicate key (1062): used to notice a row that another request stored first. */
export function isDuplicateKey(err: unknown): boolean {
	const e = err as { errno?: number; cause?: { errno?: number } } | null;
	return e?.errno === 1062 || e?.cause?.errno === 1062;
}
