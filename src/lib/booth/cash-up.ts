/**
 * A cash-up per fair day, pure: which days a fair has, which day a count belongs to, and what the
 * helper is told after a blind count. The arithmetic of each day is `reconcile` run on that day's
 * entries (the tin starts each day with the float; what was taken is lifted out at the cash-up).
 */
import { addIsoDays } from '../locale/dates';

/** Longest fair we list day by day (a fair longer than this is counted on its last 31 days). */
const MAX_DAYS = 31;

/** The fair's calendar days, first to last ('YYYY-MM-DD', UTC days as stored). */
export function fairDays(startsOn: string, endsOn: string): string[] {
	const days: string[] = [];
	for (let d = startsOn; d <= endsOn; d = addIsoDays(d, 1)) days.push(d);
	return days.slice(-MAX_DAYS);
}

/** The day a count made today belongs to: today when the fair is on, else its nearest day. */
export function countingDay(days: string[], today: string): string {
	if (days.length === 0) return today;
	if (today < days[0]) return days[0];
	if (today > days[days.length - 1]) return days[days.length - 1];
	return today;
}

/**
 * The cash in the tin for the whole fair, as if the takings had never been lifted out: the sum
 * of the fair's expected cash plus each counted day's gap. Null until some day is counted.
 */
export function wholeFairCounted(expectedMinor: number, dayGaps: (number | null)[]): number | null {
	const counted = dayGaps.filter((g): g is number => g !== null);
	return counted.length ? expectedMinor + counted.reduce((a, g) => a + g, 0) : null;
}

export type CountCheck = { ok: boolean; message: string };

/**
 * What the counter hears after saving: nothing to do when it adds up; otherwise where the gap is
 * and, while the helper's one recount is left, the question ('none': the owner, who may always
 * correct). `money` formats an amount (the shop's formatter).
 */
export function countCheck(
	cashGap: number | null,
	pieceGaps: number,
	recount: 'left' | 'used' | 'none',
	money: (minor: number) => string
): CountCheck {
	const parts: string[] = [];
	if (cashGap !== null && cashGap !== 0)
		parts.push(`the tin is ${money(Math.abs(cashGap))} ${cashGap < 0 ? 'short' : 'over'}`);
	if (pieceGaps > 0)
		parts.push(`${pieceGaps} piece count${pieceGaps === 1 ? ' does' : 's do'} not match`);
	if (parts.length === 0) return { ok: true, message: 'It adds up: cash and pieces match.' };
	const said = parts.join(' and ');
	const first = said.charAt(0).toUpperCase() + said.slice(1);
	return {
		ok: false,
		message:
			recount === 'left'
				? `${first} — count again?`
				: recount === 'used'
					? `${first}. Counted twice: the owner will look at it.`
					: `${first}.`
	};
}
