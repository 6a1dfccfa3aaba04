import { drizzle } from 'drizzle-orm/mysql2';
import mysql from 'mysql2/promise';
import * as schema from './schema';
import { config } from '../config';

/** One pooled client per process; closed on shutdown so `node build` exits on SIGTERM. */
const pool = mysql.createPool({
	uri: config.db.url,
	connectionLimit: 10,
	timezone: 'Z',
	dateStrings: false
});

export const db = drizzle(pool, { schema, mode: 'default' });
export type Db = typeof db;
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

process.on('sveltekit:shutdown', () => {
	void pool.end();
});
