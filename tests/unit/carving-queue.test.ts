import { describe, expect, it } from 'vitest';
import {
	addWorkshopDays,
	awayDays,
	daysBetween,
	readyByFor,
	scheduleQueue,
	surchargeMinor,
	type CarvingSchedule
} from '$lib/queue/carving-queue';

/**
 * A week worked out by hand on paper (the figures below are the working, not output copied
 * from the code). Weekdays come from the Gregorian calendar: 4 March 2026 is a Wednesday
 * (ISO 8601 week 10; checked against a printed 2026 calendar, from memory).
 *
 *   Hours: Mon–Fri 4 h (240 min), Sat 2 h (120 min), Sun none.
 *   Fair:  Saturday 7 March (the workshop is at the booth, no carving).
 *   Queue: A 150 min, B 200 min, C 90 min, D 300 min (740 min in all).
 *
 *   Wed 4  240 min: A 150 (done, 90 left) · B takes 90 (110 still to do)
 *   Thu 5  240 min: B 110 (done, 130 left) · C 90 (done, 40 left) · D takes 40 (260 to do)
 *   Fri 6  240 min: D takes 240 (20 to do)
 *   Sat 7  fair, 0 · Sun 8 no hours, 0
 *   Mon 9  240 min: D 20 (done, 220 left)
 *
 *   A new 45-min piece joining now: carved Mon 9 (45 ≤ 220), then finishing 2 + packing 1
 *   workshop days: Tue 10, Wed 11, Thu 12 → ready to ship Thursday 12 March 2026.
 */
const week: CarvingSchedule = {
	minutesByWeekday: [0, 240, 240, 240, 240, 240, 120],
	daysOff: [],
	finishingDays: 2,
	packingDays: 1,
	surchargePerMinuteMinor: 0
};
const fair = ['2026-03-07'];
const queue = [
	{ key: 'A', minutes: 150 },
	{ key: 'B', minutes: 200 },
	{ key: 'C', minutes: 90 },
	{ key: 'D', minutes: 300 }
];

describe('carving queue, a week by hand', () => {
	it('gives each line the day its last chip comes out', () => {
		const s = scheduleQueue(queue, week, '2026-03-04', fair);
		expect(s.map((l) => [l.key, l.carvedOn])).toEqual([
			['A', '2026-03-04'],
			['B', '2026-03-05'],
			['C', '2026-03-05'],
			['D', '2026-03-09']
		]);
		expect(s.map((l) => l.startsAfterMinutes)).toEqual([0, 150, 350, 440]);
	});

	it('dates a new 45-minute piece Thursday 12 March', () => {
		expect(readyByFor(740, 45, week, '2026-03-04', fair)).toBe('2026-03-12');
	});

	it('without the fair, D finishes on the Saturday and the new piece one workshop day sooner', () => {
		// Sat 7 gives 120 min: D's last 20 come out that day, the new piece's 45 fit beside them;
		// then Mon 9, Tue 10, Wed 11 (Sunday has no hours) → Wednesday 11 March.
		const s = scheduleQueue(queue, week, '2026-03-04');
		expect(s[3].carvedOn).toBe('2026-03-07');
		expect(readyByFor(740, 45, week, '2026-03-04')).toBe('2026-03-11');
	});

	it('a ready-made piece only waits for packing', () => {
		// Wed 4 → one workshop day of packing → Thu 5 (common practice: next-day dispatch).
		expect(readyByFor(740, 0, week, '2026-03-04', fair)).toBe('2026-03-05');
	});

	it('a day off set by the owner blocks like a fair, and today can be partly used', () => {
		const off = { ...week, daysOff: ['2026-03-05'] };
		// Wed 4 has 240 − 200 already carved = 40; A's 150 need 40 Wed + 110 Fri (Thu off).
		const [a] = scheduleQueue([queue[0]], off, '2026-03-04', [], 200);
		expect(a.carvedOn).toBe('2026-03-06');
	});

	it('a week with no hours leaves lines undated instead of looping', () => {
		const none: CarvingSchedule = { ...week, minutesByWeekday: [0, 0, 0, 0, 0, 0, 0] };
		const s = scheduleQueue(queue, none, '2026-03-04');
		expect(s.every((l) => l.carvedOn === null)).toBe(true);
		expect(readyByFor(0, 30, none, '2026-03-04')).toBeNull();
	});

	it('counts workshop days past Sundays and fair days', () => {
		// Fri 6 + 2 workshop days: Sat 7 is the fair, Sun 8 closed → Mon 9, Tue 10.
		expect(addWorkshopDays('2026-03-06', 2, week, new Set(fair))).toBe('2026-03-10');
		expect(daysBetween('2026-02-27', '2026-03-02')).toEqual([
			'2026-02-27',
			'2026-02-28', // 2026 is not a leap year (Gregorian rule), so February ends on the 28th
			'2026-03-01',
			'2026-03-02'
		]);
	});
});

/**
 * The same week, worked by hand again with the owner away "until Friday 6 March" (back that
 * day), so Wed 4 and Thu 5 give no carving. Fair on Sat 7 as before.
 *
 *   Fri 6  240 min: A 150 (done, 90 left) · B takes 90 (110 still to do)
 *   Sat 7  fair, 0 · Sun 8 no hours, 0
 *   Mon 9  240 min: B 110 (done, 130 left) · C 90 (done, 40 left) · D takes 40 (260 to do)
 *   Tue 10 240 min: D takes 240 (20 to do)
 *   Wed 11 240 min: D 20 (done, 220 left)
 *
 *   A new 45-min piece: carved Wed 11, then 2 finishing + 1 packing workshop days: Thu 12,
 *   Fri 13, Sat 14 (Saturday has 2 h, so it is a workshop day) → ready Saturday 14 March 2026,
 *   two days later than the 12th without the absence.
 */
describe('away dates move ready-by dates', () => {
	it('counts the days from today up to the day before the return', () => {
		expect(awayDays('2026-03-04', '2026-03-06')).toEqual(['2026-03-04', '2026-03-05']);
		// Back today, back in the past, or no date: no day off.
		expect(awayDays('2026-03-04', '2026-03-04')).toEqual([]);
		expect(awayDays('2026-03-04', '2026-03-01')).toEqual([]);
		expect(awayDays('2026-03-04', '')).toEqual([]);
	});

	it('pushes the queue and a new piece past the absence', () => {
		const off = [...fair, ...awayDays('2026-03-04', '2026-03-06')];
		const s = scheduleQueue(queue, week, '2026-03-04', off);
		expect(s.map((l) => [l.key, l.carvedOn])).toEqual([
			['A', '2026-03-06'],
			['B', '2026-03-09'],
			['C', '2026-03-09'],
			['D', '2026-03-11']
		]);
		expect(readyByFor(740, 45, week, '2026-03-04', off)).toBe('2026-03-14');
	});
});

describe('surcharge per minute above the standard layout', () => {
	it('is off by default and charges only the extra minutes when set', () => {
		expect(surchargeMinor(95, 60, week)).toBe(0);
		// 35 extra minutes × 10 ¢ = 350 ¢, worked by hand.
		expect(surchargeMinor(95, 60, { surchargePerMinuteMinor: 10 })).toBe(350);
		expect(surchargeMinor(50, 60, { surchargePerMinuteMinor: 10 })).toBe(0);
	});
});
