import type { DemoExtra } from './types';

/**
 * The demo's queued orders get their ready-by dates from the carving queue, through the same
 * function the app runs after a payment, instead of the rough "lead days" the seed rows carry.
 * Imported when run: the queue module uses the `$lib` alias, which tsx resolves through the
 * generated tsconfig; a missing one then fails only this step, not the whole seed.
 */
export const demoReadyBy: DemoExtra = {
	name: 'ready-by dates from the carving queue',
	run: async (db) => {
		const { keepPlansAsPromises, recomputeReadyBy } =
			await import('../../src/lib/server/queue/carving-queue');
		await db.transaction(async (tx) => {
			await recomputeReadyBy(new Date(), tx);
			// What the buyers of the demo's paid orders were told: the plan as it stands now.
			await keepPlansAsPromises(tx);
		});
	}
};
