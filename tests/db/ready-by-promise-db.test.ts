/**
 * The buyer's ready-by day: given at payment from the order's place in the carving queue, then
 * kept while the workshop's plan moves. Against the seeded test database. The queue's own
 * calendar sums are checked against hand-worked weeks in carving-queue.test.ts.
 */
import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import { carvingQueue, promiseReadyBy, recomputeReadyBy } from '$lib/server/queue/carving-queue';
import { readyAfterCarving } from '$lib/queue/carving-queue';
import { confirmationMail } from '$lib/server/orders/mail';
import { orderById } from '$lib/server/orders/views';
import { mailOrder } from '$lib/server/orders/mail-order';
import { newOrderAlertMail } from '$lib/server/orders/shipping-mail';
import { slipOrders } from '$lib/server/pdf/slip-data';
import { addIsoDays } from '$lib/locale/dates';

const row = async (id: number) => (await db.select().from(s.orders).where(eq(s.orders.id, id)))[0];

describe('the ready-by promise', () => {
	it('is the queue date at payment, and stays when the plan moves', async () => {
		const q = await carvingQueue();
		const last = q.lines.filter((l) => l.status === 'paid').at(-1);
		expect(last, 'a paid order in the seeded queue').toBeDefined();
		const id = last!.orderId;
		await db.update(s.orders).set({ promisedBy: null }).where(eq(s.orders.id, id));

		const given = await promiseReadyBy(id);
		// Its last line's carving day, then finishing and packing days (the queue's own rule).
		expect(given).toBe(readyAfterCarving(last!.carvedOn!, q.schedule, q.daysOff));
		expect((await row(id)).promisedBy).toBe(given);

		// A month later the queue starts from another day: the plan moves, the promise does not.
		const later = new Date(Date.now() + 30 * 86_400_000);
		const plan = await recomputeReadyBy(later);
		expect(plan.get(id)! >= addIsoDays(given!, 20)).toBe(true);
		expect((await row(id)).promisedBy).toBe(given);
		// Paying again (a repeated event) never rewrites a promise already given.
		await promiseReadyBy(id, later);
		expect((await row(id)).promisedBy).toBe(given);

		// Every place that tells the buyer or the owner says the promised day.
		const words = new Intl.DateTimeFormat('en-US', {
			weekday: 'long',
			month: 'long',
			day: 'numeric',
			year: 'numeric',
			timeZone: 'UTC'
		}).format(new Date(`${given}T12:00:00Z`));
		expect(confirmationMail((await orderById(id))!).text).toContain(`Ready to post by ${words}.`);
		const m = await mailOrder(id);
		expect(newOrderAlertMail(m, 'http://x', m.promisedBy).text).toContain(words);
		const { found } = await slipOrders([last!.ref]);
		expect(found[0].readyBy).toBe(words);

		await recomputeReadyBy();
	});
});
