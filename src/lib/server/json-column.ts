/**
 * MariaDB stores JSON as LONGTEXT, so mysql2 hands JSON columns back as strings; MySQL hands
 * back objects. Accept both.
 */
export function jsonValue<T>(v: unknown): T {
	return (typeof v === 'string' ? JSON.parse(v) : v) as T;
}
