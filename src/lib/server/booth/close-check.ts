import { and, eq, isNotNull, max } from 'drizzle-orm';
import { db } from '../db';
import { boothSales, fairHelpers, users } from '../db/schema';
import { countingDay } from '$lib/booth/cash-up';
import { today as todayIso } from '$lib/locale/dates';
import type { fairTally } from './tally';

type Tally = Awaited<ReturnType<typeof fairTally>>;

/**
 * What the owner reads before closing a fair: days not cashed up, pieces never counted, and for
 * each helper of the fair when their phone last sent anything. The server cannot see into a
 * phone, so it says plainly that a phone out of signal may still hold sales.
 */
export async function closeCheck(t: Tally, now = new Date()) {
	const upTo = countingDay(
		t.days.map((d) => d.day),
		todayIso(now)
	);
	const daysNotCounted = t.days.filter((d) => d.day <= upTo && !d.tally).map((d) => d.day);
	const piecesNotCounted = t.result.stock.filter((s) => s.counted === null).length;
	const phones = await db
		.select({ name: users.name, lastSent: max(boothSales.receivedAt) })
		.from(fairHelpers)
		.innerJoin(users, eq(users.id, fairHelpers.userId))
		.leftJoin(
			boothSales,
			and(
				eq(boothSales.recordedBy, fairHelpers.userId),
				eq(boothSales.fairId, fairHelpers.fairId),
				isNotNull(boothSales.receivedAt)
			)
		)
		.where(eq(fairHelpers.fairId, t.fair.id))
		.groupBy(users.id, users.name);
	return { daysNotCounted, piecesNotCounted, phones };
}
