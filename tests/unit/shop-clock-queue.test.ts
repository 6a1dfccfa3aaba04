/**
 * The ready-by date of an order placed late in the evening is worked from the shop's own day.
 * Daylight saving per the IANA tz database (US rule: second Sunday of March, 2026-03-08).
 */
import { afterEach, describe, expect, it } from 'vitest';
import { DEFAULT_SCHEDULE, readyByFor, scheduleQueue } from '$lib/queue/carving-queue';
import { isoDay, today } from '$lib/locale/dates';
import { DEFAULT_FORMAT, useShopFormat } from '$lib/locale/shop-format';

afterEach(() => useShopFormat(DEFAULT_FORMAT));

describe('an order placed at 23:50 in the workshop', () => {
	it('is dated from that evening, as worked by hand from the carving queue', () => {
		useShopFormat({ timeZone: 'America/New_York', locale: 'en-US', currency: 'USD' });
		// Friday March 6, 2026, 23:50 EST (UTC−5) is 04:50 on Saturday the 7th in UTC.
		const placed = new Date('2026-03-07T04:50:00Z');
		const day = today(placed);
		expect(day).toBe('2026-03-06');
		// Worked by hand with the default week (Mon–Fri 300 min, Sat 180, Sun none; 2 finishing and
		// 1 packing workshop day), 400 min of carving queued ahead and 200 min for this order:
		//   Fri 6: 300 min of the queue ahead (100 of it left)
		//   Sat 7: the last 100 of the queue ahead, then 80 of ours (120 left)
		//   Sun 8: no carving (clocks go forward that night; it is still one calendar day)
		//   Mon 9: our last 120 min → carved on Monday the 9th
		//   finishing Tue 10, Wed 11; packing Thu 12 → ready to post by Thursday March 12.
		const lines = scheduleQueue(
			[
				{ key: 'ahead', minutes: 400 },
				{ key: 'ours', minutes: 200 }
			],
			DEFAULT_SCHEDULE,
			day
		);
		expect(lines.map((l) => l.carvedOn)).toEqual(['2026-03-07', '2026-03-09']);
		expect(readyByFor(400, 200, DEFAULT_SCHEDULE, day)).toBe('2026-03-12');
		// Counted from the UTC day (Saturday) it would be a day later: Sat 180, Mon 220 + 80,
		// Tue 120 → carved Tue 10, ready Fri 13. That is the error the shop's zone removes.
		expect(readyByFor(400, 200, DEFAULT_SCHEDULE, isoDay(placed, 'UTC'))).toBe('2026-03-13');
	});

	it('east of UTC (Pacific/Auckland) the next morning is already a new day', () => {
		useShopFormat({ timeZone: 'Pacific/Auckland', locale: 'en-NZ', currency: 'NZD' });
		// 10:50 UTC on Friday March 6 is 23:50 NZDT (UTC+13) the same Friday in Auckland…
		expect(today(new Date('2026-03-06T10:50:00Z'))).toBe('2026-03-06');
		// …and 11:10 UTC is 00:10 on Saturday the 7th there, while UTC is still on Friday.
		const placed = new Date('2026-03-06T11:10:00Z');
		expect(today(placed)).toBe('2026-03-07');
		// Worked by hand from Saturday: Sat 180 of the 400 ahead, Mon 220 + 80 of ours, Tue 120:
		// carved Tue 10, finishing Wed 11 and Thu 12, packing Fri 13.
		expect(readyByFor(400, 200, DEFAULT_SCHEDULE, today(placed))).toBe('2026-03-13');
	});
});
