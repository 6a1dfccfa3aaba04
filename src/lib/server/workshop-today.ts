import { asc, count, gte, inArray } from 'drizzle-orm';
import { db } from './db';
import { fairs, orders, type OrderStatus } from './db/schema';

/** The orders still on the bench, by the step they are at. */
const benchSteps = ['paid', 'carving', 'finishing', 'packed'] as const satisfies OrderStatus[];

export type TodaySummary = {
	byStep: Record<(typeof benchSteps)[number], number>;
	nextFair: { id: number; name: string; place: string; startsOn: string } | null;
};

/** A short "what needs doing" for the workshop's first page. */
export async function todaySummary(today = new Date()): Promise<TodaySummary> {
	const rows = await db
		.select({ status: orders.status, n: count() })
		.from(orders)
		.where(inArray(orders.status, [...benchSteps]))
		.groupBy(orders.status);
	const byStep = { paid: 0, carving: 0, finishing: 0, packed: 0 };
	for (const r of rows) byStep[r.status as keyof typeof byStep] = Number(r.n);

	const [nextFair] = await db
		.select({ id: fairs.id, name: fairs.name, place: fairs.place, startsOn: fairs.startsOn })
		.from(fairs)
		.where(gte(fairs.endsOn, today.toISOString().slice(0, 10)))
		.orderBy(asc(fairs.startsOn))
		.limit(1);
	return { byStep, nextFair: nextFair ?? null };
}
