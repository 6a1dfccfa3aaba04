import mysql from 'mysql2/promise';

export type PoolOptions = { url: string; wsrepSyncWait: number | null };

/**
 * A mysql2 pool with the app's connection settings: times in UTC, and on a Galera cluster the
 * configured `wsrep_sync_wait` set on each new connection before it is handed out.
 */
export function openPool({ url, wsrepSyncWait }: PoolOptions) {
	const pool = mysql.createPool({
		uri: url,
		connectionLimit: 10,
		timezone: 'Z',
		dateStrings: false
	});
	if (wsrepSyncWait !== null) {
		if (!Number.isInteger(wsrepSyncWait) || wsrepSyncWait < 0 || wsrepSyncWait > 15)
			throw new Error(
				`DB_WSREP_SYNC_WAIT must be a whole number from 0 to 15, not ${wsrepSyncWait}`
			);
		// The core pool hands new connections to this event before any query runs on them, and
		// a connection runs its queries in order, so the setting is in place for the first one.
		pool.pool.on('connection', (conn) => {
			conn.query(`set session wsrep_sync_wait = ${wsrepSyncWait}`, (err) => {
				if (err) console.error('Could not set wsrep_sync_wait on a database connection', err);
			});
		});
	}
	return pool;
}
