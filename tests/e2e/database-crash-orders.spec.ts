/**
 * MariaDB killed (SIGKILL, as `kill -9`) during 20 staggered checkouts and payments, then
 * started again, against a private MariaDB, its own payment stand-in (whose signed events retry
 * with doubling delays, as the provider's do) and the shared mail stand-in. Then everything is
 * counted:
 * - every answer the app gave was a success, a 4xx or a 503 with Retry-After, never another 5xx
 *   (RFC 9110 §15.6.4: 503 + Retry-After for a temporary outage);
 * - every buyer who paid has exactly one paid order, whose piece was taken from stock once;
 * - every paid order has one buyer confirmation and one owner alert; a second copy is allowed
 *   only within the outbox's bound (after its lease, with the same Message-ID), and this app
 *   process never died, so it keeps the ones it handed over and sends none twice.
 */
import { expect, test } from '@playwright/test';
import { startApp, freePort, type AppProcess } from '../helpers/app-process';
import { copyDatabase, PrivateMariadb } from '../helpers/private-mariadb';
import { startStripeServer } from '../../mocks/stripe/server';

const DB = 'chipstall_crash';
const BUYERS = 20;
const STOCK = 100;
let server: PrivateMariadb;
let app: AppProcess;
let payments: Awaited<ReturnType<typeof startStripeServer>>;
const inboxPort = process.env.TEST_INBOX_PORT || '8125';
const tag = `crash${Date.now() % 100000}`;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

test.beforeAll(async () => {
	test.setTimeout(120_000);
	server = new PrivateMariadb('crash');
	await server.create(DB);
	copyDatabase(process.env.DATABASE_URL!, server, DB);
	const conn = await server.root();
	try {
		await conn.query(
			`update ${DB}.stock s join ${DB}.pieces p on p.id = s.piece_id join ${DB}.woods w on w.id = s.wood_id
			 set s.quantity = ? where p.slug = 'trinket-box' and w.slug = 'basswood' and s.place = 'workshop'`,
			[STOCK]
		);
	} finally {
		await conn.end();
	}
	const stripePort = await freePort();
	app = await startApp({
		DATABASE_URL: server.url(DB),
		STRIPE_API_HOST: '127.0.0.1',
		STRIPE_API_PORT: String(stripePort),
		STRIPE_API_PROTOCOL: 'http',
		OUTBOX_EVERY_MS: '1000',
		// Each buyer comes from an address of their own, as real buyers do.
		ADDRESS_HEADER: 'x-forwarded-for'
	});
	payments = await startStripeServer({
		port: stripePort,
		webhookUrl: `${app.url}/api/payments/webhook`,
		retryBaseMs: 250,
		maxAttempts: 10
	});
});

test.afterAll(async () => {
	await payments?.close();
	await app?.stop();
	await server?.destroy();
});

test('a database crash mid-checkout: one charge, stock once, one letter each, only 503s', async () => {
	test.setTimeout(240_000);
	const statuses: number[] = [];
	const missingRetryAfter: string[] = [];

	/** One request to the app; a 503 is waited out (its Retry-After), then the buyer presses again. */
	async function call(what: string, run: () => Promise<Response>): Promise<Response> {
		const deadline = Date.now() + 90_000;
		for (;;) {
			let res: Response | null = null;
			try {
				res = await run();
			} catch {
				// The connection itself failed: try again.
			}
			if (res) {
				statuses.push(res.status);
				if (res.status !== 503) return res;
				const wait = Number(res.headers.get('retry-after'));
				if (!wait) missingRetryAfter.push(what);
				await res.arrayBuffer();
				if (Date.now() > deadline) throw new Error(`${what}: still failing`);
				await sleep((wait || 1) * 1000);
				continue;
			}
			if (Date.now() > deadline) throw new Error(`${what}: still failing`);
			await sleep(1000);
		}
	}

	async function buy(i: number) {
		await sleep(i * 300); // staggered: some before the crash, some during, some after
		const email = `${tag}-${i}@example.test`;
		const from = `10.77.0.${i + 1}`;
		const added = await call('add', () =>
			fetch(`${app.url}/api/cart`, {
				method: 'POST',
				headers: { 'content-type': 'application/json', origin: app.url, 'x-forwarded-for': from },
				body: JSON.stringify({ slug: 'trinket-box', wood: 'basswood', quantity: 1 })
			})
		);
		expect(added.status).toBe(200);
		const cart = added.headers
			.getSetCookie()
			.find((c) => c.startsWith('cart='))!
			.split(';')[0];
		const checkout = await call('checkout', () =>
			fetch(`${app.url}/checkout`, {
				method: 'POST',
				redirect: 'manual',
				headers: {
					'content-type': 'application/x-www-form-urlencoded',
					origin: app.url,
					accept: 'text/html', // a plain form post: the redirect comes as a 303
					cookie: cart,
					'x-forwarded-for': from
				},
				body: new URLSearchParams({
					name: `Crash Buyer ${i}`,
					email,
					line1: '1 Test Lane',
					city: 'Testville',
					region: 'VT',
					postcode: '05002',
					country: 'US'
				}).toString()
			})
		);
		expect(checkout.status).toBe(303);
		const payUrl = checkout.headers.get('location')!;
		expect(payUrl).toContain(`127.0.0.1:${payments.port}/pay/`);
		// The payment page is the provider's: it does not need our database.
		const paid = await fetch(payUrl, {
			method: 'POST',
			redirect: 'manual',
			headers: { 'content-type': 'application/x-www-form-urlencoded' },
			body: new URLSearchParams({
				number: '4242424242424242', // the provider's documented test card
				expiry: '12/40',
				cvc: '123',
				name: `Crash Buyer ${i}`
			}).toString()
		});
		expect(paid.status).toBe(303);
		return email;
	}

	const buyers = Promise.all(Array.from({ length: BUYERS }, (_, i) => buy(i)));
	await sleep(2500);
	await server.kill();
	await sleep(6000);
	await server.start();
	const emails = await buyers;

	// The provider's retries land, and the outbox drains (its lease is 30 s at most).
	const root = await server.root();
	try {
		const paidOrders = async () =>
			(
				(await root.query(
					`select id, ref, email, status from ${DB}.orders where email like ? and status = 'paid'`,
					[`${tag}-%`]
				)) as unknown as [{ id: number; ref: string; email: string; status: string }[]]
			)[0];
		await expect
			.poll(async () => (await paidOrders()).length, { timeout: 90_000, intervals: [1000] })
			.toBe(BUYERS);
		await expect
			.poll(
				async () =>
					Number(
						(
							(await root.query(
								`select count(*) as n from ${DB}.outbox where status = 'pending'`
							)) as unknown as [{ n: number }[]]
						)[0][0].n
					),
				{ timeout: 90_000, intervals: [1000] }
			)
			.toBe(0);

		// Only 503 among the 5xx, always with Retry-After, for buyers and the provider alike.
		expect(statuses.filter((s) => s >= 500 && s !== 503)).toEqual([]);
		expect(missingRetryAfter).toEqual([]);
		const hookStatuses = payments.state.deliveries.flatMap((d) =>
			d.attempts.flatMap((a) => (a.status ? [a.status] : []))
		);
		expect(hookStatuses.filter((s) => s >= 500 && s !== 503)).toEqual([]);
		expect(payments.state.deliveries.every((d) => d.delivered)).toBe(true);

		const orders = await paidOrders();
		// One paid order per buyer.
		expect(new Set(orders.map((o) => o.email)).size).toBe(BUYERS);
		expect(orders.map((o) => o.email).sort()).toEqual([...emails].sort());
		// Stock taken once per paid order (held, or taken again after a lapse; never twice).
		for (const o of orders) {
			const [[row]] = (await root.query(
				`select coalesce(sum(delta), 0) as d from ${DB}.stock_adjustments where reason like ?`,
				[`%${o.ref}%`]
			)) as unknown as [{ d: number }[]];
			expect(Number(row.d), o.ref).toBe(-1);
		}
		const [[shelf]] = (await root.query(
			`select s.quantity as q from ${DB}.stock s join ${DB}.pieces p on p.id = s.piece_id
			 join ${DB}.woods w on w.id = s.wood_id
			 where p.slug = 'trinket-box' and w.slug = 'basswood' and s.place = 'workshop'`
		)) as unknown as [{ q: number }[]];
		expect(shelf.q).toBe(STOCK - BUYERS);

		// One confirmation to each buyer and one alert to the owner per order.
		const [[owner]] = (await root.query(
			`select email from ${DB}.users where role = 'owner' limit 1`
		)) as unknown as [{ email: string }[]];
		const inbox = async (to: string) =>
			(await (
				await fetch(`http://127.0.0.1:${inboxPort}/api/messages?to=${encodeURIComponent(to)}`)
			).json()) as { id: string; subject: string }[];
		const messageId = async (id: string) =>
			/^message-id:\s*(\S+)/im.exec(
				await (await fetch(`http://127.0.0.1:${inboxPort}/api/messages/${id}/raw`)).text()
			)?.[1];
		/** One letter; a second copy only as a resend of the same outbox row (same Message-ID). */
		async function oneLetter(list: { id: string; subject: string }[], what: string) {
			expect(list.length, what).toBeGreaterThanOrEqual(1);
			expect(list.length, what).toBeLessThanOrEqual(2);
			const ids = new Set(await Promise.all(list.map((m) => messageId(m.id))));
			expect(ids.size, `${what}: copies share one Message-ID`).toBe(1);
		}
		const ownerMail = await inbox(owner.email);
		let copies = 0;
		for (const o of orders) {
			// Exactly one outbox row for each letter: written once, with the payment.
			const [[buyerRows]] = (await root.query(
				`select count(*) as n from ${DB}.outbox where subject = ?`,
				[`Order ${o.ref} is paid — thank you`]
			)) as unknown as [{ n: number }[]];
			expect(Number(buyerRows.n), o.ref).toBe(1);
			const [[alertRows]] = (await root.query(
				`select count(*) as n from ${DB}.outbox where subject like ?`,
				[`New order ${o.ref} %`]
			)) as unknown as [{ n: number }[]];
			expect(Number(alertRows.n), o.ref).toBe(1);
			const buyerMail = (await inbox(o.email)).filter(
				(m) => m.subject === `Order ${o.ref} is paid — thank you`
			);
			await oneLetter(buyerMail, `${o.ref} buyer`);
			const alerts = ownerMail.filter((m) => m.subject.startsWith(`New order ${o.ref}`));
			await oneLetter(alerts, `${o.ref} owner`);
			copies += buyerMail.length - 1 + alerts.length - 1;
		}
		// Resends are the exception: logged by the app, and few.
		expect(copies).toBeLessThanOrEqual(orders.length / 4);
	} finally {
		await root.end();
	}
});
