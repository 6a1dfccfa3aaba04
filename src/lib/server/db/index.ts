import { drizzle } from 'drizzle-orm/mysql2';
import * as schema from './schema';
import { config } from '../config';
import { openPool } from './pool';

/** One pooled client per process; closed on shutdown so `node build` exits on SIGTERM. */
const pool = openPool({ url: config.db.url, wsrepSyncWait: config.db.wsrepSyncWait });

export const db = drizzle(pool, { schema, mode: 'default' });
export type Db = typeof db;
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

process.on('sveltekit:shutdown', () => {
	void pool.end();
});
