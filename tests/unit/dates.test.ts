import { afterEach, describe, expect, it } from 'vitest';
import { addDays, addIsoDays, formatDay, isoDay, today } from '$lib/dates';
import { readyBy } from '$lib/personalised-price';

const savedTz = process.env.TZ;
afterEach(() => {
	process.env.TZ = savedTz;
});

describe('one calendar: UTC days everywhere', () => {
	it('at 23:30 local time the day is the UTC day, the same on the server and in the browser', () => {
		// Node re-reads TZ when it changes, so this process's clock is now California's.
		process.env.TZ = 'America/Los_Angeles';
		// 23:30 on Wednesday March 4, 2026 in California (PST is UTC−8, per the IANA tz database)
		// is 07:30 on Thursday March 5 in UTC.
		const lateEvening = new Date('2026-03-05T07:30:00Z');
		expect(lateEvening.getHours()).toBe(23);
		expect(lateEvening.getMinutes()).toBe(30);
		expect(lateEvening.getDate()).toBe(4); // local arithmetic would start from the 4th …
		// … but every day here starts from the UTC day. Reference for the local day: ICU through
		// Intl.DateTimeFormat with an explicit zone.
		const localDay = new Intl.DateTimeFormat('en-CA', { timeZone: 'America/Los_Angeles' }).format(
			lateEvening
		);
		expect(localDay).toBe('2026-03-04');
		expect(today(lateEvening)).toBe('2026-03-05');
		expect(isoDay(lateEvening)).toBe('2026-03-05');
		// Ten lead days: the 15th, as the server computes it, not the 14th a local sum would give.
		expect(readyBy(10, lateEvening)).toBe('2026-03-15');
		expect(addDays(lateEvening, 10)).toBe('2026-03-15');
		// March 15, 2026 is a Sunday (any calendar).
		expect(formatDay(readyBy(10, lateEvening), 'weekday')).toBe('Sunday, March 15');
	});

	it('gives the same answers in another zone (east of UTC)', () => {
		process.env.TZ = 'Pacific/Auckland';
		const lateEvening = new Date('2026-03-05T07:30:00Z'); // 20:30 on the 5th in Auckland (NZDT)
		expect(readyBy(10, lateEvening)).toBe('2026-03-15');
		expect(formatDay('2026-03-15', 'medium')).toBe('Mar 15, 2026');
	});

	it('day sums cross month ends and leap days', () => {
		// 2028 is a leap year (Gregorian rule: divisible by 4, not a century).
		expect(addIsoDays('2028-02-28', 1)).toBe('2028-02-29');
		expect(addIsoDays('2028-02-29', 1)).toBe('2028-03-01');
		expect(addIsoDays('2026-02-28', 1)).toBe('2026-03-01');
		expect(addIsoDays('2026-01-01', -1)).toBe('2025-12-31');
	});
});
