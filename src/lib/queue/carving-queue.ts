/**
 * The carving queue: paid made-to-order lines waiting for the knife, fitted into the carver's
 * weekly hours, give each line the day it should be carved and each new order its ready-by date.
 * Pure and dependency-free so the personaliser can run it in the browser with the figures the
 * server sends. Dates are the shop's calendar days (`YYYY-MM-DD`, "today" from `$lib/locale/dates` in
 * the shop's zone); adding to them is plain calendar arithmetic, the same on every machine.
 */
import { addIsoDays, weekdayOf } from '../locale/dates';

/** Carving minutes available on each weekday, Sunday first (JavaScript's getDay order). */
export type WeekHours = [number, number, number, number, number, number, number];

export type CarvingSchedule = {
	minutesByWeekday: WeekHours;
	/** Days the workshop is shut (holidays, "away until"); fair days are added to these. */
	daysOff: string[];
	/** Workshop days after carving for oil to cure and the piece to be checked. */
	finishingDays: number;
	/** Workshop days to pack and hand the parcel over. */
	packingDays: number;
	/** Minor units per estimated minute above the piece's standard layout; 0 = off. */
	surchargePerMinuteMinor: number;
};

export const DEFAULT_SCHEDULE: CarvingSchedule = {
	// Weekdays 5 h, Saturday 3 h, Sunday off (an invented but ordinary week for a one-person shop).
	minutesByWeekday: [0, 300, 300, 300, 300, 300, 180],
	daysOff: [],
	finishingDays: 2,
	packingDays: 1,
	surchargePerMinuteMinor: 0
};

export type QueueLine<K = string> = { key: K; minutes: number };
export type ScheduledLine<K = string> = QueueLine<K> & {
	/** Minutes of queue carved before this line starts. */
	startsAfterMinutes: number;
	/** The day its last chip comes out; null when no carving hours lie ahead within a year. */
	carvedOn: string | null;
};

/** Far enough ahead for any real queue; stops the walk when no weekday has hours. */
const HORIZON_DAYS = 366;

const weekday = weekdayOf;

/** Every ISO day from `from` to `to` inclusive (a fair's days, a holiday). */
export function daysBetween(from: string, to: string): string[] {
	const out: string[] = [];
	for (let d = from; d <= to && out.length <= HORIZON_DAYS; d = addIsoDays(d, 1)) out.push(d);
	return out;
}

/**
 * The days the owner is away ("away until" the day they are back): from `today` up to the day
 * before `until`. Nothing when `until` is empty or already here. The start is today because an
 * absence that began earlier only matters from now on.
 */
export function awayDays(today: string, until: string): string[] {
	if (!until || until <= today) return [];
	return daysBetween(today, addIsoDays(until, -1));
}

/** Carving minutes on one day: the weekday's hours unless the day is off. */
export function capacityOn(iso: string, s: CarvingSchedule, off: ReadonlySet<string>): number {
	if (off.has(iso)) return 0;
	return Math.max(0, s.minutesByWeekday[weekday(iso)] ?? 0);
}

/**
 * Walks the queue in order through the days from `today`, each day giving its carving minutes.
 * A line is carved on the day its last minute is spent. `usedToday` is carving already done
 * today on other work (so a late-afternoon order does not assume a fresh day).
 */
export function scheduleQueue<K>(
	lines: QueueLine<K>[],
	s: CarvingSchedule,
	today: string,
	extraDaysOff: string[] = [],
	usedToday = 0
): ScheduledLine<K>[] {
	const off = new Set([...s.daysOff, ...extraDaysOff]);
	let day = today;
	let dayIndex = 0;
	let left = Math.max(0, capacityOn(day, s, off) - usedToday);
	let ahead = 0;
	const out: ScheduledLine<K>[] = [];
	for (const line of lines) {
		let need = Math.max(0, Math.ceil(line.minutes));
		let carvedOn: string | null = null;
		for (;;) {
			// A line with no carving left is done wherever the walk stands.
			if (need === 0 || need <= left) {
				left -= need;
				carvedOn = day;
				break;
			}
			need -= left;
			day = addIsoDays(day, 1);
			dayIndex++;
			if (dayIndex > HORIZON_DAYS) break;
			left = capacityOn(day, s, off);
		}
		out.push({ ...line, startsAfterMinutes: ahead, carvedOn });
		ahead += Math.max(0, Math.ceil(line.minutes));
		if (carvedOn === null) {
			// Nothing more can be placed either; keep the rest unscheduled.
			for (const rest of lines.slice(out.length)) {
				out.push({ ...rest, startsAfterMinutes: ahead, carvedOn: null });
				ahead += Math.max(0, Math.ceil(rest.minutes));
			}
			break;
		}
	}
	return out;
}

/** `n` workshop days after `iso` (days with carving hours that are not off). */
export function addWorkshopDays(
	iso: string,
	n: number,
	s: CarvingSchedule,
	off: ReadonlySet<string>
): string | null {
	let day = iso;
	for (let counted = 0, i = 0; counted < n;) {
		day = addIsoDays(day, 1);
		if (++i > HORIZON_DAYS) return null;
		if (capacityOn(day, s, off) > 0) counted++;
	}
	return day;
}

/** The day a piece carved on `carvedOn` can ship: after its finishing and packing days. */
export function readyAfterCarving(
	carvedOn: string,
	s: CarvingSchedule,
	extraDaysOff: string[] = []
): string | null {
	const off = new Set([...s.daysOff, ...extraDaysOff]);
	return addWorkshopDays(carvedOn, s.finishingDays + s.packingDays, s, off);
}

/**
 * The day a piece needing `minutes` of carving can ship if it joins the back of the queue now:
 * carved when the queue ahead and its own minutes are spent, then finishing and packing days.
 * A piece with no carving (ready-made) only waits for packing.
 */
export function readyByFor(
	minutesAhead: number,
	minutes: number,
	s: CarvingSchedule,
	today: string,
	extraDaysOff: string[] = []
): string | null {
	const off = new Set([...s.daysOff, ...extraDaysOff]);
	if (minutes <= 0) return addWorkshopDays(today, s.packingDays, s, off);
	const [, me] = scheduleQueue(
		[
			{ key: 'ahead', minutes: minutesAhead },
			{ key: 'this', minutes }
		],
		s,
		today,
		extraDaysOff
	);
	if (!me.carvedOn) return null;
	return readyAfterCarving(me.carvedOn, s, extraDaysOff);
}

/** Optional surcharge for a layout that takes longer than the piece's standard one. */
export function surchargeMinor(
	minutes: number,
	standardMinutes: number,
	s: Pick<CarvingSchedule, 'surchargePerMinuteMinor'>
): number {
	const per = Math.max(0, Math.floor(s.surchargePerMinuteMinor));
	if (per === 0) return 0;
	return Math.max(0, Math.ceil(minutes) - Math.ceil(standardMinutes)) * per;
}

/**
 * The ready-by day to tell the buyer anywhere (order page, e-mails, slips): the promise kept when
 * the order was paid (see promiseReadyBy in the server's queue module), else the plan.
 */
export function buyerReadyBy(o: { promisedBy: string | null; readyBy: string | null }) {
	return o.promisedBy ?? o.readyBy;
}
