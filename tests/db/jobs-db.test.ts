/**
 * Once-per-interval jobs and the connection settings for a cluster, against the test database.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { config } from '$lib/server/config';
import { db } from '$lib/server/db';
import { openPool } from '$lib/server/db/pool';
import { runIfDue } from '$lib/server/jobs/once-per-interval';

describe('once-per-interval jobs claim their turn by a row', () => {
	it('of 12 concurrent attempts in one turn exactly one runs the job', async () => {
		const name = `test-job-${process.pid}`;
		let runs = 0;
		const job = () => Promise.resolve(++runs);
		// A turn of an hour, so all attempts fall in one turn unless the hour turns over mid-test.
		const won = await Promise.all(Array.from({ length: 12 }, () => runIfDue(name, 3_600_000, job)));
		expect(won.filter(Boolean).length).toBe(runs);
		expect(runs).toBe(1);
		const [rows] = await db.$client.query('select count from job_runs where name = ?', [name]);
		expect(rows).toEqual([{ count: 1 }]);
	});

	it('a later turn runs again', async () => {
		const name = `test-job-turns-${process.pid}`;
		let runs = 0;
		expect(await runIfDue(name, 200, () => Promise.resolve(++runs))).toBe(true);
		await new Promise((r) => setTimeout(r, 450));
		expect(await runIfDue(name, 200, () => Promise.resolve(++runs))).toBe(true);
		expect(runs).toBe(2);
	});
});

describe('wsrep_sync_wait on the app connections', () => {
	const pools: ReturnType<typeof openPool>[] = [];
	afterAll(async () => {
		await Promise.all(pools.map((p) => p.end()));
	});

	it('is set on every connection when configured, and left to the server when not', async () => {
		// MariaDB's Galera documentation: wsrep_sync_wait is a session variable (0 = no wait).
		const set = openPool({ url: config.db.url, wsrepSyncWait: 1 });
		const unset = openPool({ url: config.db.url, wsrepSyncWait: null });
		pools.push(set, unset);
		const [[a]] = (await set.query('select @@session.wsrep_sync_wait as w')) as unknown as [
			{ w: number }[]
		];
		const [[b]] = (await unset.query('select @@session.wsrep_sync_wait as w')) as unknown as [
			{ w: number }[]
		];
		expect(Number(a.w)).toBe(1);
		expect(Number(b.w)).toBe(0);
	});

	it('refuses a value MariaDB does not take', () => {
		expect(() => openPool({ url: config.db.url, wsrepSyncWait: 99 })).toThrow(/0 to 15/);
	});
});
