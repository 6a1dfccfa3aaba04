/**
 * The workshop's plan follows what it depends on without a route asking: fair days are days off
 * in the carving queue, so adding a fair over the queue's days pushes every queued order's
 * ready-by date past the fair, and moving the fair away brings the dates back. Against the seeded
 * test database, through the fairs module as the workshop's fair form calls it.
 */
import { eq, inArray } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import { carvingQueue, replanQueue } from '$lib/server/queue/carving-queue';
import { createFair, updateFair } from '$lib/server/fairs/fairs';
import { fairFormSchema } from '$lib/fairs/schemas';
import { addIsoDays } from '$lib/locale/dates';

const form = (startsOn: string, endsOn: string) =>
	fairFormSchema.parse({
		name: `Replan test ${process.pid}`,
		place: 'Test Hall',
		startsOn,
		endsOn,
		boothFee: '0',
		otherCosts: '0',
		salesTax: '0',
		cashFloat: '0',
		cardFee: '0',
		helperDiscount: '0',
		openHours: '8'
	});

async function readyBys(ids: number[]) {
	const rows = await db
		.select({ id: s.orders.id, readyBy: s.orders.readyBy })
		.from(s.orders)
		.where(inArray(s.orders.id, ids));
	return new Map(rows.map((r) => [r.id, r.readyBy]));
}

describe('the plan follows the fairs', () => {
	it('a fair over the queue’s days moves every queued order past it; moved away, they come back', async () => {
		await replanQueue();
		const q = await carvingQueue();
		const carved = q.lines.filter((l) => l.carvedOn);
		expect(carved.length, 'made-to-order lines in the seeded queue').toBeGreaterThan(0);
		const ids = [...new Set(carved.map((l) => l.orderId))];
		const before = await readyBys(ids);
		const lastCarving = carved.map((l) => l.carvedOn!).sort()[carved.length - 1];

		// A fair on every day the queue now carves: no carving can happen on any of them (a fair day
		// is a day off, the queue's rule), so each order is ready only after the fair's last day.
		const fairId = await createFair(form(q.today, lastCarving));
		try {
			const during = await readyBys(ids);
			for (const id of ids) {
				expect(during.get(id)! > lastCarving, `order ${id} after the fair`).toBe(true);
				expect(during.get(id)! > before.get(id)!, `order ${id} later than before`).toBe(true);
			}

			// Moved to well after every date: the plan is the one without it again.
			const far = addIsoDays([...during.values()].sort().at(-1)!, 400);
			await updateFair(fairId, form(far, addIsoDays(far, 1)));
			expect(await readyBys(ids)).toEqual(before);
		} finally {
			await db.delete(s.fairs).where(eq(s.fairs.id, fairId));
			await replanQueue();
		}
	});
});
