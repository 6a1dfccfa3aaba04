/**
 * The per-day cash-up's pure parts against worked examples done by hand (common practice for a
 * fair's cash tin: each day starts with the float, the day's takings are lifted out at its count).
 */
import { describe, expect, it } from 'vitest';
import { countCheck, countingDay, fairDays, wholeFairCounted } from '$lib/booth/cash-up';
import { formatMoney } from '$lib/locale/money';

const usd = (m: number) => formatMoney(m, 'USD');

describe('fair days', () => {
	it('lists every calendar day of a fair, across a month end', () => {
		// From a calendar: June has 30 days.
		expect(fairDays('2026-06-29', '2026-07-02')).toEqual([
			'2026-06-29',
			'2026-06-30',
			'2026-07-01',
			'2026-07-02'
		]);
		expect(fairDays('2026-03-07', '2026-03-07')).toEqual(['2026-03-07']);
	});

	it('puts a count on today, or on the nearest fair day before or after the fair', () => {
		const days = ['2026-07-04', '2026-07-05'];
		expect(countingDay(days, '2026-07-05')).toBe('2026-07-05');
		expect(countingDay(days, '2026-07-01')).toBe('2026-07-04');
		expect(countingDay(days, '2026-07-09')).toBe('2026-07-05');
	});
});

describe('the whole fair from its days', () => {
	it('is the expected cash plus the counted days’ gaps, and nothing until a day is counted', () => {
		// By hand: expected 430.00 over two days; day 1 matched, day 2 was 5.00 short → 425.00.
		expect(wholeFairCounted(43_000, [0, -500])).toBe(42_500);
		expect(wholeFairCounted(43_000, [null, -500])).toBe(42_500);
		expect(wholeFairCounted(43_000, [null, null])).toBeNull();
	});
});

describe('what the helper is told after a blind count', () => {
	it('says the tin is 5.00 short and asks for a recount while one is left', () => {
		expect(countCheck(-500, 0, 'left', usd)).toEqual({
			ok: false,
			message: 'The tin is $5.00 short — count again?'
		});
	});

	it('names pieces that do not match, and stops asking after the recount', () => {
		expect(countCheck(250, 2, 'used', usd).message).toBe(
			'The tin is $2.50 over and 2 piece counts do not match. Counted twice: the owner will look at it.'
		);
		expect(countCheck(null, 1, 'left', usd).message).toBe(
			'1 piece count does not match — count again?'
		);
	});

	it('tells the owner plainly, without asking', () => {
		expect(countCheck(-500, 0, 'none', usd).message).toBe('The tin is $5.00 short.');
	});

	it('is content when cash and pieces match', () => {
		expect(countCheck(0, 0, 'left', usd).ok).toBe(true);
	});
});
