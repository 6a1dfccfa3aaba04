/**
 * Calendar days and how we write them, in one place. Stored days ('YYYY-MM-DD': ready-by, fair
 * dates) are calendar days with no clock time, so every sum and every format here works in UTC:
 * a day computed on the server and shown in the browser never slips by one near midnight.
 */

const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/;

/** The calendar day `days` after the UTC day of `from`, as 'YYYY-MM-DD'. */
export function addDays(from: Date, days: number): string {
	const d = new Date(Date.UTC(from.getUTCFullYear(), from.getUTCMonth(), from.getUTCDate()));
	d.setUTCDate(d.getUTCDate() + Math.max(0, Math.ceil(days)));
	return d.toISOString().slice(0, 10);
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
	weekdayLong: { weekday: 'long', month: 'long', day: 'numeric', year: 'numeric' }
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
