/**
 * MariaDB stopped and started while requests run: while it is down the app answers 503 with a
 * plain page (no stack trace), it serves again within 5 s of the database coming back without
 * being restarted, and every write it confirmed is still there.
 */
import { expect, test } from '@playwright/test';
import { startApp, type AppProcess } from '../helpers/app-process';
import { copyDatabase, PrivateMariadb } from '../helpers/private-mariadb';

const DB = 'chipstall_fault';
let server: PrivateMariadb;
let app: AppProcess;

test.beforeAll(async () => {
	test.setTimeout(90_000);
	server = new PrivateMariadb('fault');
	await server.create(DB);
	copyDatabase(process.env.DATABASE_URL!, server, DB);
	app = await startApp({ DATABASE_URL: server.url(DB) });
});

test.afterAll(async () => {
	await app?.stop();
	await server?.destroy();
});

type Confirmed = { cartId: string };

/** One basket write: confirmed (200 and a cart cookie) or refused. */
async function addToBasket(): Promise<Confirmed | number> {
	try {
		const res = await fetch(`${app.url}/api/cart`, {
			method: 'POST',
			headers: { 'content-type': 'application/json', origin: app.url },
			body: JSON.stringify({ slug: 'rosette-bottle-holder', wood: 'cherry', initials: 'DB' })
		});
		if (res.status !== 200) return res.status;
		const cookie = res.headers.getSetCookie().find((c) => c.startsWith('cart='));
		return { cartId: cookie!.split(';')[0].split('=')[1] };
	} catch {
		return -1;
	}
}

test('the app rides out a database restart', async () => {
	test.setTimeout(90_000);
	expect(typeof (await addToBasket())).toBe('object');

	const confirmed: Confirmed[] = [];
	const refused: number[] = [];
	let running = true;
	const writer = (async () => {
		while (running) {
			const r = await addToBasket();
			if (typeof r === 'number') refused.push(r);
			else confirmed.push(r);
			await new Promise((r) => setTimeout(r, 30));
		}
	})();

	await new Promise((r) => setTimeout(r, 500));
	await server.stop();

	// Down: plain 503 pages, JSON 503 for the API, never a stack trace.
	await expect
		.poll(async () => (await fetch(`${app.url}/shop`)).status, { timeout: 5000 })
		.toBe(503);
	const page = await fetch(`${app.url}/shop`);
	const html = await page.text();
	expect(page.headers.get('retry-after')).toBe('5');
	expect(html).toContain('Back in a moment');
	expect(html).not.toMatch(/\bat .+\.js:\d+|Error:|ECONNREFUSED/);
	const api = await fetch(`${app.url}/api/cart`);
	expect(api.status).toBe(503);
	expect(((await api.json()) as { error: string }).error).toMatch(/try again/i);

	await new Promise((r) => setTimeout(r, 1000));
	await server.start();
	const back = Date.now();
	await expect
		.poll(async () => (await fetch(`${app.url}/shop`)).status, { timeout: 5000, intervals: [100] })
		.toBe(200);
	expect(Date.now() - back).toBeLessThan(5000);

	await new Promise((r) => setTimeout(r, 500));
	running = false;
	await writer;
	expect(refused.length, 'some writes were refused while the database was down').toBeGreaterThan(0);
	expect(refused.every((s) => s === 503)).toBe(true);
	expect(confirmed.length).toBeGreaterThan(0);

	// Every write the app confirmed is in the database.
	const conn = await server.root();
	try {
		const ids = confirmed.map((c) => c.cartId);
		const [rows] = (await conn.query(
			`select c.id, count(l.id) as n from ${DB}.carts c join ${DB}.cart_lines l on l.cart_id = c.id
			 where c.id in (?) group by c.id`,
			[ids]
		)) as unknown as [{ id: string; n: number }[]];
		expect(rows.map((r) => r.id).sort()).toEqual([...ids].sort());
		expect(rows.every((r) => Number(r.n) === 1)).toBe(true);
	} finally {
		await conn.end();
	}
});
