/**
 * Runs a transaction again when MariaDB gives up on it for a deadlock (errno 1213) or a lock-wait
 * timeout (1205): both leave nothing written, and a second try usually goes through.
 */
export async function withLockRetry<T>(run: () => Promise<T>, tries = 4): Promise<T> {
	for (let attempt = 1; ; attempt++) {
		try {
			return await run();
		} catch (err) {
			const errno = lockErrno(err);
			if (attempt >= tries || (errno !== 1213 && errno !== 1205)) throw err;
			await new Promise((r) => setTimeout(r, 20 * attempt + Math.random() * 30));
		}
	}
}

/** drizzle wraps the driver's error; the errno sits on it or on its cause. */
export function lockErrno(err: unknown): number | undefined {
	const e = err as { errno?: number; cause?: { errno?: number } };
	return e?.errno ?? e?.cause?.errno;
}
