/**
 * Calendar days, clock times and how we write them, in one place: nothing else converts a moment
 * to a day or an hour, or formats a date.
 *
 * Moments are stored in UTC. Every day and hour shown or counted is the shop's own, in its time
 * zone (`shopFormat().timeZone`, an IANA name): "today", a booth sale's day, the carving queue's
 * days, an order's history. The server and the buyer's browser read the same shop-wide zone, so a
 * ready-by date worked out on the piece page is the one the order record gets, whatever the
 * buyer's or the server's own clock says.
 *
 * Stored days ('YYYY-MM-DD': ready-by, fair dates, days off) are calendar days with no clock
 * time; adding days to them is plain calendar arithmetic (done in UTC, which has no daylight
 * saving, so a day is always 24 hours there).
 */
import { shopFormat } from './shop-format';

const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/;
const DAY_MS = 86_400_000;

/** One formatter per zone: building an Intl.DateTimeFormat is the slow part. */
const partFormats = new Map<string, Intl.DateTimeFormat>();

/** The wall-clock fields of a moment in a zone (24-hour clock, ISO calendar). */
export function wallClock(d: Date, timeZone = shopFormat().timeZone) {
	let f = partFormats.get(timeZone);
	if (!f) {
		f = new Intl.DateTimeFormat('en-US', {
			timeZone,
			hourCycle: 'h23',
			year: 'numeric',
			month: '2-digit',
			day: '2-digit',
			hour: '2-digit',
			minute: '2-digit',
			second: '2-digit'
		});
		partFormats.set(timeZone, f);
	}
	const p: Record<string, string> = {};
	for (const { type, value } of f.formatToParts(d)) p[type] = value;
	return {
		year: Number(p.year),
		month: Number(p.month),
		day: Number(p.day),
		hour: Number(p.hour),
		minute: Number(p.minute),
		second: Number(p.second)
	};
}

/** Formatters kept by locale and options: the settings list alone formats 400-odd zones. */
const formats = new Map<string, Intl.DateTimeFormat>();
function formatter(locale: string, options: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
	const key = `${locale}|${JSON.stringify(options)}`;
	let f = formats.get(key);
	if (!f) {
		if (formats.size > 2000) formats.clear();
		f = new Intl.DateTimeFormat(locale, options);
		formats.set(key, f);
	}
	return f;
}

const pad = (n: number, w = 2) => String(Math.abs(n)).padStart(w, '0');

/** The shop's calendar day of a moment, as 'YYYY-MM-DD'. */
export function isoDay(d: Date, timeZone = shopFormat().timeZone): string {
	const c = wallClock(d, timeZone);
	return `${pad(c.year, 4)}-${pad(c.month)}-${pad(c.day)}`;
}

/** The shop's calendar month of a moment, as 'YYYY-MM' (report periods). */
export function isoMonth(d: Date, timeZone = shopFormat().timeZone): string {
	return isoDay(d, timeZone).slice(0, 7);
}

/** The hour (0–23) on the shop's clock at a moment (takings by hour). */
export function localHour(d: Date, timeZone = shopFormat().timeZone): number {
	return wallClock(d, timeZone).hour;
}

/** Minutes the zone is ahead of UTC at a moment (negative west of Greenwich). */
export function offsetMinutes(d: Date, timeZone = shopFormat().timeZone): number {
	const c = wallClock(d, timeZone);
	const asUtc = Date.UTC(c.year, c.month - 1, c.day, c.hour, c.minute, c.second);
	return Math.round((asUtc - Math.floor(d.getTime() / 1000) * 1000) / 60_000);
}

/**
 * A moment as ISO 8601 local time with its offset, e.g. 2026-03-08T03:30:00-04:00: what CSV
 * exports carry, so a spreadsheet shows the shop's clock and can still get back to UTC.
 */
export function localIso(d: Date, timeZone = shopFormat().timeZone): string {
	const c = wallClock(d, timeZone);
	const off = offsetMinutes(d, timeZone);
	const sign = off < 0 ? '-' : '+';
	return (
		`${pad(c.year, 4)}-${pad(c.month)}-${pad(c.day)}T${pad(c.hour)}:${pad(c.minute)}:${pad(c.second)}` +
		`${sign}${pad(Math.floor(Math.abs(off) / 60))}:${pad(Math.abs(off) % 60)}`
	);
}

/** Today's calendar day in the shop, as 'YYYY-MM-DD'. */
export function today(now: Date = new Date()): string {
	return isoDay(now);
}

/** The calendar day `days` (rounded up, never negative) after the shop's day of `from`. */
export function addDays(from: Date, days: number): string {
	return addIsoDays(isoDay(from), Math.max(0, Math.ceil(days)));
}

/** The calendar day `days` after (or before, when negative) a stored day. */
export function addIsoDays(iso: string, days: number): string {
	return new Date(Date.parse(`${iso}T00:00:00Z`) + days * DAY_MS).toISOString().slice(0, 10);
}

/** The weekday of a stored day, Sunday = 0 (a calendar fact, the same in every zone). */
export function weekdayOf(iso: string): number {
	return new Date(`${iso}T00:00:00Z`).getUTCDay();
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
	weekdayShortLong: { weekday: 'short', month: 'long', day: 'numeric', year: 'numeric' },
	/** March 2026 */
	month: { month: 'long', year: 'numeric' },
	/** Mar 2026 */
	monthShort: { month: 'short', year: 'numeric' }
} as const satisfies Record<string, Intl.DateTimeFormatOptions>;

export type DayStyle = keyof typeof STYLES;

/**
 * A stored day ('YYYY-MM-DD', or 'YYYY-MM' for a month) or a moment in the shop's words; `empty`
 * when there is none. A stored day is that calendar day everywhere; a moment is shown on the
 * shop's clock.
 */
export function formatDay(
	d: Date | string | null | undefined,
	style: DayStyle,
	empty = ''
): string {
	if (!d) return empty;
	const { locale, timeZone } = shopFormat();
	if (typeof d === 'string' && (ISO_DAY.test(d) || /^\d{4}-\d{2}$/.test(d))) {
		const day = d.length === 7 ? `${d}-15` : d;
		return formatter(locale, { ...STYLES[style], timeZone: 'UTC' }).format(
			new Date(`${day}T12:00:00Z`)
		);
	}
	const at = typeof d === 'string' ? new Date(d) : d;
	if (Number.isNaN(at.getTime())) return empty;
	return formatter(locale, { ...STYLES[style], timeZone }).format(at);
}

/** A moment with its clock time on the shop's clock: "Mar 4, 3:05 PM". */
export function formatMoment(d: Date | string, timeZone = shopFormat().timeZone): string {
	const at = typeof d === 'string' ? new Date(d) : d;
	return formatter(shopFormat().locale, {
		month: 'short',
		day: 'numeric',
		hour: 'numeric',
		minute: '2-digit',
		timeZone
	}).format(at);
}

/** The clock time in a zone: "3:05 PM", or "Saturday 3:05 PM" (the settings' "now there"). */
export function formatClock(
	d: Date,
	timeZone = shopFormat().timeZone,
	locale = shopFormat().locale,
	withWeekday = false
): string {
	return formatter(locale, {
		...(withWeekday ? { weekday: 'long' } : {}),
		hour: 'numeric',
		minute: '2-digit',
		timeZone
	}).format(d);
}

/** Every IANA zone this runtime knows, for the settings list (UTC first). */
export function timeZoneNames(): string[] {
	const names = Intl.supportedValuesOf?.('timeZone') ?? [];
	return ['UTC', ...names.filter((n) => n !== 'UTC')];
}

/** True when the runtime knows the zone (a name typed or posted by hand may not be one). */
export function isTimeZone(name: string): boolean {
	try {
		new Intl.DateTimeFormat('en-US', { timeZone: name });
		return /^[A-Za-z_]+(\/[A-Za-z0-9_+-]+)*$/.test(name);
	} catch {
		return false;
	}
}
