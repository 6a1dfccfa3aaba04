/**
 * Calendar days and how we write them, in one place; nothing else does day arithmetic or formats
 * a date.
 *
 * The choice: UTC, everywhere. Stored days ('YYYY-MM-DD': ready-by, fair dates, days off) are
 * calendar days with no clock time, and the same sum runs on the server (which prices and stores
 * the order) and in the buyer's browser (which shows the promise before checkout). Local-time
 * arithmetic gives those two different answers whenever the buyer's clock and the server's sit
 * on either side of midnight (at 23:30 in California it is already tomorrow in UTC), so the page
 * would promise one day and the order record another. Working in UTC makes every day the same
 * in every process and every browser; the cost, "today" turning over at UTC midnight rather than
 * the buyer's, is a few hours' difference on a promise measured in days.
 */

const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/;
const DAY_MS = 86_400_000;

/** The UTC calendar day of a moment, as 'YYYY-MM-DD'. */
export function isoDay(d: Date): string {
	return d.toISOString().slice(0, 10);
}

/** Today's calendar day (UTC), as 'YYYY-MM-DD'. */
export function today(now: Date = new Date()): string {
	return isoDay(now);
}

/** The calendar day `days` (rounded up, never negative) after the UTC day of `from`. */
export function addDays(from: Date, days: number): string {
	return addIsoDays(isoDay(from), Math.max(0, Math.ceil(days)));
}

/** The calendar day `days` after (or before, when negative) a stored day. */
export function addIsoDays(iso: string, days: number): string {
	return isoDay(new Date(Date.parse(`${iso}T00:00:00Z`) + days * DAY_MS));
}

/** A stored day or a moment as a Date at noon UTC (noon: the same day in every time zone). */
function asDate(d: Date | string): Date {
	if (typeof d !== 'string') return d;
	return new Date(ISO_DAY.test(d) ? `${d}T12:00:00Z` : d);
}

const STYLES = {
	/** Mar 4 */
	short: { month: 'short', day: 'numeric' },
	/** Mar 4, 2026 */
	medium: { month: 'short', day: 'numeric', year: 'numeric' },
	/** March 4, 2026 */
	long: { month: 'long', day: 'numeric', year: 'numeric' },
	/** Wed, Mar 4 */
	weekdayShort: { weekday: 'short', month: 'short', day: 'numeric' },
	/** Wednesday, March 4 */
	weekday: { weekday: 'long', month: 'long', day: 'numeric' },
	/** Wednesday, March 4, 2026 */
	weekdayLong: { weekday: 'long', month: 'long', day: 'numeric', year: 'numeric' },
	/** Wed, March 4, 2026 */
	weekdayShortLong: { weekday: 'short', month: 'long', day: 'numeric', year: 'numeric' }
} as const satisfies Record<string, Intl.DateTimeFormatOptions>;

export type DayStyle = keyof typeof STYLES;

/** A day or a moment in plain US English words; `empty` when there is none. */
export function formatDay(
	d: Date | string | null | undefined,
	style: DayStyle,
	empty = ''
): string {
	if (!d) return empty;
	return asDate(d).toLocaleDateString('en-US', { ...STYLES[style], timeZone: 'UTC' });
}

/** A moment with its clock time, in UTC and saying so: "Mar 4, 3:05 PM UTC". */
export function formatMoment(d: Date): string {
	return d.toLocaleString('en-US', {
		month: 'short',
		day: 'numeric',
		hour: 'numeric',
		minute: '2-digit',
		timeZone: 'UTC',
		timeZoneName: 'short'
	});
}
