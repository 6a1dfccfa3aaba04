/**
 * The shop's clock. Daylight-saving rules checked here are those of the IANA tz database
 * (America/New_York follows the US rule since 2007: clocks go forward at 02:00 on the second
 * Sunday of March and back at 02:00 on the first Sunday of November; Pacific/Auckland is UTC+13
 * in summer until 03:00 on the first Sunday of April). Moments through a year are also checked
 * against @date-fns/tz, a reference implementation independent of ours.
 */
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { TZDate } from '@date-fns/tz';
import {
	addDays,
	addIsoDays,
	formatDay,
	formatMoment,
	isoDay,
	isoMonth,
	localHour,
	localIso,
	offsetMinutes,
	today,
	weekdayOf
} from '$lib/locale/dates';
import { readyBy } from '$lib/catalogue/personalised-price';
import { DEFAULT_FORMAT, useShopFormat } from '$lib/locale/shop-format';

const NY = { timeZone: 'America/New_York', locale: 'en-US', currency: 'USD' };
const savedTz = process.env.TZ;
beforeEach(() => useShopFormat(NY));
afterEach(() => {
	process.env.TZ = savedTz;
	useShopFormat(DEFAULT_FORMAT);
});

describe("the shop's own day, whatever the machine's clock", () => {
	it('a sale at 23:30 in the workshop counts on that day, not the next UTC day', () => {
		// The server runs on another zone's clock: only the shop's zone may matter.
		process.env.TZ = 'America/Los_Angeles';
		// Saturday June 6, 2026, 23:30 EDT (UTC−4) is 03:30 on Sunday the 7th in UTC.
		const sale = new Date('2026-06-07T03:30:00Z');
		expect(sale.toISOString().slice(0, 10)).toBe('2026-06-07');
		expect(isoDay(sale)).toBe('2026-06-06');
		expect(today(sale)).toBe('2026-06-06');
		expect(localHour(sale)).toBe(23);
		expect(localIso(sale)).toBe('2026-06-06T23:30:00-04:00');
		expect(isoDay(new Date('2026-06-07T04:00:00Z'))).toBe('2026-06-07'); // local midnight
	});

	it('lead days count from the local day of an order at 23:50', () => {
		// Friday March 6, 2026, 23:50 EST (UTC−5) = 04:50 Saturday in UTC.
		const order = new Date('2026-03-07T04:50:00Z');
		expect(readyBy(10, order)).toBe('2026-03-16');
		expect(addDays(order, 10)).toBe('2026-03-16');
		// March 16, 2026 is a Monday (any calendar).
		expect(formatDay(readyBy(10, order), 'weekday')).toBe('Monday, March 16');
	});

	it('the spring-forward day (second Sunday of March 2026: the 8th) has 23 hours', () => {
		expect(weekdayOf('2026-03-08')).toBe(0);
		const beforeJump = new Date('2026-03-08T06:59:00Z');
		const afterJump = new Date('2026-03-08T07:00:00Z');
		expect(localIso(beforeJump)).toBe('2026-03-08T01:59:00-05:00');
		expect(localIso(afterJump)).toBe('2026-03-08T03:00:00-04:00');
		// Local midnight to local midnight: 05:00Z on the 8th to 04:00Z on the 9th.
		expect(isoDay(new Date('2026-03-08T04:59:59Z'))).toBe('2026-03-07');
		expect(isoDay(new Date('2026-03-08T05:00:00Z'))).toBe('2026-03-08');
		expect(isoDay(new Date('2026-03-09T03:59:59Z'))).toBe('2026-03-08');
		expect(isoDay(new Date('2026-03-09T04:00:00Z'))).toBe('2026-03-09');
		const hours = new Set<number>();
		for (let t = Date.parse('2026-03-08T05:00:00Z'); t < Date.parse('2026-03-09T04:00:00Z');) {
			hours.add(localHour(new Date(t)));
			t += 3_600_000;
		}
		expect(hours.size).toBe(23);
		expect(hours.has(2)).toBe(false); // 02:00–02:59 does not happen that night
		// The days either side stay the same calendar days to add to.
		expect(addIsoDays('2026-03-07', 1)).toBe('2026-03-08');
		expect(addIsoDays('2026-03-08', 1)).toBe('2026-03-09');
	});

	it('the fall-back day (first Sunday of November 2026: the 1st) has 25 hours', () => {
		expect(weekdayOf('2026-11-01')).toBe(0);
		// 01:30 happens twice: first in EDT, then an hour later in EST.
		expect(localIso(new Date('2026-11-01T05:30:00Z'))).toBe('2026-11-01T01:30:00-04:00');
		expect(localIso(new Date('2026-11-01T06:30:00Z'))).toBe('2026-11-01T01:30:00-05:00');
		expect(isoDay(new Date('2026-11-01T03:59:59Z'))).toBe('2026-10-31');
		expect(isoDay(new Date('2026-11-01T04:00:00Z'))).toBe('2026-11-01');
		expect(isoDay(new Date('2026-11-02T04:59:59Z'))).toBe('2026-11-01');
		expect(isoDay(new Date('2026-11-02T05:00:00Z'))).toBe('2026-11-02');
		// A sale at 23:30 on Sunday November 1 (EST now, UTC−5) stays on the 1st.
		expect(isoDay(new Date('2026-11-02T04:30:00Z'))).toBe('2026-11-01');
		expect(isoMonth(new Date('2026-11-01T03:30:00Z'))).toBe('2026-10'); // Oct 31, 23:30 EDT
	});

	it('a shop east of UTC (Pacific/Auckland) is already on the next day', () => {
		useShopFormat({ timeZone: 'Pacific/Auckland', locale: 'en-NZ', currency: 'NZD' });
		process.env.TZ = 'UTC';
		// 11:30 UTC on March 5 is 00:30 on Friday March 6 in Auckland (NZDT, UTC+13).
		const morning = new Date('2026-03-05T11:30:00Z');
		expect(isoDay(morning)).toBe('2026-03-06');
		expect(localIso(morning)).toBe('2026-03-06T00:30:00+13:00');
		expect(offsetMinutes(morning)).toBe(13 * 60);
		// After the first Sunday of April (April 5, 2026) it is NZST, UTC+12.
		expect(offsetMinutes(new Date('2026-04-06T00:00:00Z'))).toBe(12 * 60);
		// A sale at 23:30 local on April 10 is 11:30 UTC the same date.
		expect(isoDay(new Date('2026-04-10T11:30:00Z'))).toBe('2026-04-10');
		expect(isoDay(new Date('2026-04-10T12:00:00Z'))).toBe('2026-04-11');
		expect(readyBy(10, morning)).toBe('2026-03-16');
	});

	it('agrees with @date-fns/tz through 2026 in both zones (every 97 minutes)', () => {
		for (const zone of ['America/New_York', 'Pacific/Auckland']) {
			for (
				let t = Date.parse('2026-01-01T00:17:00Z');
				t < Date.parse('2027-01-01');
				t += 97 * 60_000
			) {
				const ref = new TZDate(t, zone);
				const d = new Date(t);
				const refDay = `${ref.getFullYear()}-${String(ref.getMonth() + 1).padStart(2, '0')}-${String(ref.getDate()).padStart(2, '0')}`;
				expect(isoDay(d, zone)).toBe(refDay);
				expect(localHour(d, zone)).toBe(ref.getHours());
				// TZDate gives minutes *behind* UTC, as Date#getTimezoneOffset does.
				expect(offsetMinutes(d, zone)).toBe(-ref.getTimezoneOffset());
			}
		}
	});
});

describe('writing days and moments', () => {
	it('shows history times on the shop clock, never in UTC', () => {
		// 19:32 UTC on March 9 (after the change) is 3:32 PM EDT.
		const at = new Date('2026-03-09T19:32:00Z');
		expect(formatMoment(at)).toBe('Mar 9, 3:32 PM');
		expect(formatMoment(at)).not.toMatch(/UTC|GMT/);
		// A moment late in the evening is dated by the shop's day.
		expect(formatDay(new Date('2026-06-07T03:30:00Z'), 'medium')).toBe('Jun 6, 2026');
		// A stored day is that day in any zone.
		useShopFormat({ timeZone: 'Pacific/Auckland', locale: 'en-NZ', currency: 'NZD' });
		expect(formatDay('2026-03-15', 'weekday')).toMatch(/Sunday,? 15 March/);
	});

	it("uses the shop's locale (de-DE) for day and month names", () => {
		useShopFormat({ timeZone: 'Europe/Berlin', locale: 'de-DE', currency: 'EUR' });
		expect(formatDay('2026-03-15', 'weekdayLong')).toBe('Sonntag, 15. März 2026');
		expect(formatDay('2026-10', 'month')).toBe('Oktober 2026');
		// 19:32 UTC in March is 20:32 in Berlin (CET, UTC+1).
		expect(formatMoment(new Date('2026-03-09T19:32:00Z'))).toBe('9. März, 20:32');
	});

	it('day sums cross month ends and leap days', () => {
		// 2028 is a leap year (Gregorian rule: divisible by 4, not a century).
		expect(addIsoDays('2028-02-28', 1)).toBe('2028-02-29');
		expect(addIsoDays('2028-02-29', 1)).toBe('2028-03-01');
		expect(addIsoDays('2026-02-28', 1)).toBe('2026-03-01');
		expect(addIsoDays('2026-01-01', -1)).toBe('2025-12-31');
	});
});
