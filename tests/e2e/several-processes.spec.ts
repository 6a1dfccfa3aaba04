/**
 * Two app processes on different ports against one MariaDB, requests alternating between them,
 * as behind a reverse proxy: nothing may depend on which process answers.
 */
import { expect, test } from '@playwright/test';
import { drizzle } from 'drizzle-orm/mysql2';
import { eq, like } from 'drizzle-orm';
import mysql from 'mysql2/promise';
import * as s from '../../src/lib/server/db/schema';
import { startApp, signInCookie, type AppProcess } from '../helpers/app-process';
import { completedEvent, insertPendingOrder, signEvent } from '../helpers/payment-fixture';
import { demoAccount } from './helpers/auth';

let a: AppProcess;
let b: AppProcess;
let pool: mysql.Pool;

test.beforeAll(async () => {
	test.setTimeout(60_000);
	[a, b] = await Promise.all([startApp(), startApp()]);
	pool = mysql.createPool({ uri: process.env.DATABASE_URL!, connectionLimit: 2 });
});

test.afterAll(async () => {
	await Promise.all([a?.stop(), b?.stop()]);
	await pool?.end();
});

test('signed in on one process, the next request on the other is signed in too', async () => {
	const { email, password } = demoAccount('helper');
	const cookie = await signInCookie(a.url, email, password);
	for (const app of [b, a, b]) {
		const res = await fetch(`${app.url}/workshop/orders`, {
			headers: { cookie, accept: 'text/html' },
			redirect: 'manual'
		});
		expect(res.status).toBe(200);
	}
	const api = await fetch(`${b.url}/api/workshop/orders`, { headers: { cookie } });
	expect(api.status).toBe(200);
});

test('a payment event and its retry on different processes change the order once', async () => {
	const db = drizzle(pool, { schema: s, mode: 'default' });
	const tag = `mp${process.pid}${Date.now() % 100000}`;
	const ref = `CS-${tag.slice(-6).toUpperCase().padStart(6, 'M')}`;
	const email = `two-processes-${tag}@example.test`;
	const orderId = await insertPendingOrder(db, ref, tag, email);
	const body = completedEvent(`evt_${tag}`, ref, tag);
	const secret = process.env.STRIPE_WEBHOOK_SECRET || 'whsec_chipstall_local';
	const post = (app: AppProcess) =>
		fetch(`${app.url}/api/payments/webhook`, {
			method: 'POST',
			headers: { 'stripe-signature': signEvent(body, secret), 'content-type': 'application/json' },
			body
		});
	// The provider retries when it sees no answer in time: both copies may arrive together.
	const [first, retry] = await Promise.all([post(a), post(b)]);
	expect([first.status, retry.status]).toEqual([200, 200]);
	const changed = [
		((await first.json()) as { changed: boolean }).changed,
		((await retry.json()) as { changed: boolean }).changed
	];
	expect(changed.filter(Boolean)).toHaveLength(1);
	const [order] = await db.select().from(s.orders).where(eq(s.orders.id, orderId));
	expect(order.status).toBe('paid');
	const events = await db
		.select()
		.from(s.processedEvents)
		.where(eq(s.processedEvents.id, `evt_${tag}`));
	expect(events).toHaveLength(1);
	// One confirmation in the outbox, not one per process.
	const mails = await db
		.select()
		.from(s.outbox)
		.where(like(s.outbox.recipients, `%${tag}%`));
	expect(mails).toHaveLength(1);
});

test('catalogue changes made elsewhere show on every process within seconds', async () => {
	const slug = 'rosette-bottle-holder';
	const before = await (await fetch(`${a.url}/shop/${slug}`)).text();
	await fetch(`${b.url}/shop/${slug}`);
	const [[row]] = (await pool.query('select title from pieces where slug = ?', [
		slug
	])) as unknown as [{ title: string }[]];
	const changed = `${row.title} (edited)`;
	await pool.query('update pieces set title = ? where slug = ?', [changed, slug]);
	try {
		for (const app of [a, b]) {
			await expect
				.poll(async () => (await fetch(`${app.url}/shop/${slug}`)).text(), { timeout: 5000 })
				.toContain(changed);
		}
		expect(before).not.toContain(changed);
	} finally {
		await pool.query('update pieces set title = ? where slug = ?', [row.title, slug]);
	}
});
