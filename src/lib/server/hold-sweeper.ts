import { releaseExpiredHolds } from './orders';

const EVERY_MS = 60_000;

/**
 * Puts pieces held by abandoned checkouts back on the shelf once a minute, in case the payment
 * provider's expiry event never arrives. One timer per process, unref'd so it never keeps the
 * server alive on shutdown.
 */
export function startHoldSweeper() {
	const timer = setInterval(() => {
		releaseExpiredHolds().catch((err) => console.error('Releasing expired holds failed', err));
	}, EVERY_MS);
	timer.unref();
	process.once('sveltekit:shutdown', () => clearInterval(timer));
}
