import { recomputeReadyBy } from '../orders/carving-queue';
import type { DemoExtra } from './extras';

/**
 * The demo's queued orders get their ready-by dates from the carving queue, through the same
 * function the app runs after a payment, instead of the rough "lead days" the seed rows carry.
 */
export const demoReadyBy: DemoExtra = {
	name: 'ready-by dates from the carving queue',
	run: async (db) => {
		await db.transaction(async (tx) => {
			await recomputeReadyBy(new Date(), tx);
		});
	}
};
