import { formatDay } from '$lib/locale/dates';

/** A ready-by day as the buyer reads it in letters and on slips ("soon" before it is known). */
export function readyByWords(iso: string | null) {
	return formatDay(iso, 'weekdayLong', 'soon');
}
