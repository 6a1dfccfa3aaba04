/**
 * Figures for the page cache (issue: every shopper fast): a basket cookie made through the real
 * form, a flood of unique addresses beside cached visitors, and the catalogue version check with
 * a long order history. Load from autocannon (npm); prints nothing itself.
 */
import autocannon from 'autocannon';
import mysql from 'mysql2/promise';

/** Puts one ready-made piece in a new basket through the piece page's form; the cookie. */
export async function basketCookie(base: string, piecePath: string, wood: string) {
	const res = await fetch(`${base}${piecePath}?/add`, {
		method: 'POST',
		redirect: 'manual',
		headers: {
			accept: 'text/html',
			origin: base,
			'content-type': 'application/x-www-form-urlencoded'
		},
		body: new URLSearchParams({ mode: 'ready', wood, quantity: '1' })
	});
	const cookie = res.headers.getSetCookie().find((c) => c.startsWith('cart='));
	if (!cookie) throw new Error(`no basket cookie (answer ${res.status})`);
	return cookie.split(';')[0];
}

export type UniqueFlood = {
	floodReqPerSec: number;
	cachedP99Ms: number;
	cachedP50Ms: number;
	cachedReqPerSec: number;
	non2xx: number;
	errors: number;
	timeouts: number;
};

/**
 * 100 connections asking `/shop` and piece pages each with a never-seen query string while 10
 * connections of ordinary visitors ask `/shop`: the visitors' p99 (target < 100 ms).
 */
export async function uniqueAddressFlood(
	base: string,
	piecePath: string,
	seconds: number
): Promise<UniqueFlood> {
	let n = 0;
	const junk = () => `utm_source=x${n++}&ref=${Math.random().toString(36).slice(2)}`;
	const [flood, visitors] = await Promise.all([
		autocannon({
			url: base,
			connections: 100,
			duration: seconds,
			timeout: 10,
			requests: [
				{
					setupRequest: (req) => ({
						...req,
						path: n % 2 ? `/shop?kind=plate&${junk()}` : `${piecePath}?${junk()}`
					})
				}
			]
		}),
		autocannon({ url: `${base}/shop`, connections: 10, duration: seconds, timeout: 10 })
	]);
	return {
		floodReqPerSec: Math.round(flood.requests.average),
		cachedP99Ms: visitors.latency.p99,
		cachedP50Ms: visitors.latency.p50,
		cachedReqPerSec: Math.round(visitors.requests.average),
		non2xx: flood.non2xx + visitors.non2xx,
		errors: flood.errors + visitors.errors,
		timeouts: flood.timeouts + visitors.timeouts
	};
}

/**
 * Fills order_history to `rows` (on the first seeded order) and times the query the app runs for
 * the catalogue version (catalogue-cache.ts), averaged over 2,000 sequential runs.
 */
export async function versionCheckAt(url: string, rows: number) {
	const conn = await mysql.createConnection(url);
	try {
		const [[{ c }]] = (await conn.query('SELECT COUNT(*) AS c FROM order_history')) as unknown as [
			{ c: number }[]
		];
		const [[order]] = (await conn.query(
			'SELECT id, status FROM orders ORDER BY id LIMIT 1'
		)) as unknown as [{ id: number; status: string }[]];
		for (let have = Number(c); have < rows;) {
			const batch = Math.min(5000, rows - have);
			const values = Array.from({ length: batch }, () => [
				order.id,
				order.status,
				order.status,
				'bench history row',
				new Date()
			]);
			await conn.query(
				'INSERT INTO order_history (order_id, from_status, to_status, reason, created_at) VALUES ?',
				[values]
			);
			have += batch;
		}
		const runs = 2000;
		const ask = () => conn.query('SELECT n FROM catalogue_version WHERE id = 1');
		for (let i = 0; i < 50; i++) await ask();
		const t0 = performance.now();
		for (let i = 0; i < runs; i++) await ask();
		return { historyRows: rows, meanMs: (performance.now() - t0) / runs };
	} finally {
		await conn.end();
	}
}
