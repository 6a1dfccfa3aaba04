/** Calendar days ('YYYY-MM-DD') in short words, the same on every machine whatever its zone. */
export function shortDay(day: string | null | undefined, withWeekday = false): string {
	if (!day) return '—';
	return new Date(`${day}T00:00:00Z`).toLocaleDateString('en-US', {
		...(withWeekday ? { weekday: 'short' as const } : {}),
		month: 'short',
		day: 'numeric',
		timeZone: 'UTC'
	});
}
