import { customType } from 'drizzle-orm/mysql-core';

/**
 * A JSON column that is an object on both sides. MariaDB stores JSON as LONGTEXT, so mysql2 hands
 * it back as a string (MySQL hands back the object): parsing here, on read, means no query has to
 * remember to. The SQL type stays `json`, so migrations see no change. Narrow it with `.$type<T>()`.
 */
export const json = customType<{ data: unknown; driverData: string }>({
	dataType: () => 'json',
	toDriver: (value) => JSON.stringify(value),
	fromDriver: (value): unknown =>
		typeof value === 'string' ? (JSON.parse(value) as unknown) : value
});
