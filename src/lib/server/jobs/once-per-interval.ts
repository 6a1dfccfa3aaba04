import { hostname } from 'node:os';
import { sql } from 'drizzle-orm';
import { db } from '../db';
import { jobRuns } from '../db/schema';

/**
 * Runs `job` once per `everyMs` in total across every app process on one database, not once per
 * process. Each process looks every quarter interval; under a MariaDB named lock (so two never
 * decide at once) it asks the job_runs table when the job last ran anywhere, by the database's
 * clock, and runs it only when an interval has passed, recording the run. If one process stops,
 * another takes its turn within a quarter interval.
 */
export async function runIfDue(
	name: string,
	everyMs: number,
	job: () => Promise<number>
): Promise<boolean> {
	const conn = await db.$client.getConnection();
	const lock = `chipstall_job_${name}`;
	try {
		const [got] = await conn.query('select get_lock(?, 0) as got', [lock]);
		if ((got as { got: number | null }[])[0]?.got !== 1) return false;
		try {
			// A little slack, so a timer that fires a few ms early does not skip a whole turn.
			const [recent] = await conn.query(
				'select count(*) as n from job_runs where name = ? and ran_at > now(3) - interval ? microsecond',
				[name, Math.max(0, everyMs - 50) * 1000]
			);
			if (Number((recent as { n: number | string }[])[0]?.n) > 0) return false;
			const count = await job();
			// The database's clock, as in the check above: app processes' clocks may differ.
			await db
				.insert(jobRuns)
				.values({ name, ranAt: sql`now(3)`, ranBy: `${hostname()}:${process.pid}`, count });
			return true;
		} finally {
			await conn.query('select release_lock(?)', [lock]);
		}
	} finally {
		conn.release();
	}
}

/** Starts the per-process timer for `runIfDue`; unref'd, and stopped on shutdown. */
export function startOncePerInterval(name: string, everyMs: number, job: () => Promise<number>) {
	const timer = setInterval(
		() => {
			runIfDue(name, everyMs, job).catch((err) => console.error(`Job ${name} failed`, err));
		},
		Math.max(50, Math.floor(everyMs / 4))
	);
	timer.unref();
	process.once('sveltekit:shutdown', () => clearInterval(timer));
}
