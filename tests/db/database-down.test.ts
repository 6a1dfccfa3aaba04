/**
 * What counts as "the database is down" (answered 503 + Retry-After by the availability handle),
 * with errors made by mysql2 and drizzle themselves against the real MariaDB, not written by
 * hand: a query on a connection that already died ("connection is in closed state"), and a
 * transaction whose connection is killed mid-way, so that its ROLLBACK fails too. A plain SQL
 * mistake is not an outage. RFC 9110 §15.6.4: 503 with Retry-After for a temporary condition.
 */
import mysql from 'mysql2/promise';
import { sql } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '$lib/server/db';
import { config } from '$lib/server/config';
import { isDatabaseDown } from '$lib/server/http/availability';

describe('isDatabaseDown', () => {
	it('a query on a connection that is gone', async () => {
		const conn = await mysql.createConnection({ uri: config.db.url });
		conn.destroy();
		const err = await conn.query('select 1').catch((e: unknown) => e);
		expect(String((err as Error).message)).toMatch(/closed state/);
		expect(isDatabaseDown(err)).toBe(true);
	});

	it('a transaction whose connection was killed: the failed rollback is an outage too', async () => {
		const err = await db
			.transaction(async (tx) => {
				await tx.execute(sql`kill connection_id()`);
				await tx.execute(sql`select 1`);
			})
			.catch((e: unknown) => e);
		expect(err).toBeInstanceOf(Error);
		expect(isDatabaseDown(err)).toBe(true);
		// The pool carries on with a fresh connection.
		const [rows] = (await db.execute(sql`select 1 as one`)) as unknown as [{ one: number }[]];
		expect(rows[0].one).toBe(1);
	});

	it('a mistake in a query is not an outage', async () => {
		const err = await db.execute(sql`select * from no_such_table_here`).catch((e: unknown) => e);
		expect(isDatabaseDown(err)).toBe(false);
	});
});
