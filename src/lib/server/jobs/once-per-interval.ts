import { hostname } from 'node:os';
import { and, eq, sql } from 'drizzle-orm';
import { db } from '../db';
import { isDuplicateKey } from '../db/retry';
import { jobRuns } from '../db/schema';

/**
 * Runs `job` once per `everyMs` in total across every app process on one database, not once per
 * process. Time is cut into turns of `everyMs` by the database's clock (app processes' clocks may
 * differ); each process looks every quarter interval and claims the current turn by inserting its
 * row. The unique (name, turn) key lets one insert win and the others fail as duplicates. Unlike
 * a named lock (`GET_LOCK`, which a Galera cluster keeps per node), a row is arbitrated by every
 * node alike. If one process stops, another claims the next turn.
 */
export async function runIfDue(
	name: string,
	everyMs: number,
	job: () => Promise<number>
): Promise<boolean> {
	const [rows] = await db.$client.query('select floor(unix_timestamp(now(3)) * 1000 / ?) as turn', [
		everyMs
	]);
	const turn = Number((rows as { turn: number | string }[])[0].turn);
	try {
		await db
			.insert(jobRuns)
			.values({ name, turn, ranAt: sql`now(3)`, ranBy: `${hostname()}:${process.pid}` });
	} catch (err) {
		if (isDuplicateKey(err)) return false;
		throw err;
	}
	const count = await job();
	await db
		.update(jobRuns)
		.set({ count })
		.where(and(eq(jobRuns.name, name), eq(jobRuns.turn, turn)));
	return true;
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
