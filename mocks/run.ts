/**
 * Shared "run directly" helper for the stand-ins: start, report the port, and close cleanly on
 * SIGINT/SIGTERM so the start script can stop them without leaving sockets behind.
 */
export function runUntilSignal(name: string, start: () => Promise<{ close(): Promise<void> }>) {
	start()
		.then((server) => {
			const stop = () => {
				// The process exits in `finally`, so a failed close has nowhere to be reported.
				void server.close().finally(() => process.exit(0));
			};
			process.once('SIGINT', stop);
			process.once('SIGTERM', stop);
		})
		.catch((err) => {
			console.error(`${name} stand-in failed to start:`, err);
			process.exit(1);
		});
}

/** True when the given module file is the process entry point (`tsx mocks/x/server.ts`). */
export function isMain(metaUrl: string) {
	const entry = process.argv[1];
	if (!entry) return false;
	const here = new URL(metaUrl).pathname;
	return here === entry || here === entry + '.ts' || here.replace(/\.ts$/, '') === entry;
}
