/**
 * An order taken at the booth, against the real MariaDB and the mail stand-in: written by the
 * orders module (order, line snapshot, history) beside the booth's deposit entry, dated by the
 * carving queue, confirmed to the buyer by e-mail; it cannot ship until the owner records the
 * balance as paid, and two clicks on "balance paid" record it once.
 */
import { and, eq, like } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import { mailTo, testPiece, testWood } from '../helpers/fixtures';
import { createFair } from '$lib/server/fairs/fairs';
import { placeBoothOrder } from '$lib/server/booth/order';
import { moveOrder } from '$lib/server/orders/status';
import { fairFormSchema } from '$lib/fairs/schemas';
import { POST as shipApi } from '../../src/routes/api/workshop/orders/[ref]/shipments/+server';
import { actions } from '../../src/routes/workshop/orders/[ref]/+page.server';
import { DomainError } from '$lib/server/errors/domain-error';

const tag = `bo${process.pid}${Date.now() % 100000}`;
let woodId = 0;
let fairId = 0;
let owner: { id: string; email: string; name: string; role: 'owner' };
let helper: { id: string; role: 'helper' };

const boothOrder = (n: number, extra: Record<string, unknown> = {}) => ({
	id: `${tag}-order-${n}`,
	at: new Date().toISOString(),
	pieceSlug: `${tag}-orn`,
	woodSlug: `${tag}-wood`,
	initials: 'JR',
	name: 'Rowan Fairgoer',
	email: `${tag}-${n}@example.test`,
	line1: '9 Mill Row',
	city: 'Linden Ford',
	postcode: '80302',
	country: 'US',
	depositMinor: 1000,
	method: 'cash' as const,
	delivery: 'collect' as const,
	...extra
});

type Result = { status?: number; data?: Record<string, unknown> } & Record<string, unknown>;
const call = (
	name: 'balance' | 'ship',
	ref: string,
	fields: Record<string, string>,
	role = 'owner'
) =>
	(actions[name] as (e: unknown) => Promise<Result>)({
		locals: { user: { ...owner, role } },
		url: new URL(`http://localhost/workshop/orders/${ref}?/${name}`),
		params: { ref },
		request: new Request('http://localhost', { method: 'POST', body: new URLSearchParams(fields) })
	});

const shipJson = (ref: string) =>
	shipApi({
		locals: { user: owner },
		url: new URL(`http://localhost/api/workshop/orders/${ref}/shipments`),
		params: { ref },
		request: new Request('http://localhost', {
			method: 'POST',
			body: JSON.stringify({ carrier: 'USPS', trackingNumber: '9400111899223344556677' })
		})
	} as unknown as Parameters<typeof shipApi>[0]);

beforeAll(async () => {
	woodId = await testWood(`${tag}-wood`);
	await testPiece(`${tag}-orn`, [woodId], {
		title: 'Test ornament',
		kind: 'ornament',
		personalisable: true
	});
	const [o] = await db.select().from(s.users).where(eq(s.users.role, 'owner')).limit(1);
	owner = { id: o.id, email: o.email, name: o.name, role: 'owner' };
	const [h] = await db.select().from(s.users).where(eq(s.users.role, 'helper')).limit(1);
	helper = { id: h.id, role: 'helper' };
	// A fair in the past (its days do not block the queue) that is still open for orders.
	fairId = await createFair(
		fairFormSchema.parse({
			name: `${tag} fair`,
			place: 'Test Hall',
			// Today: an order dated outside the fair's days is refused.
			startsOn: new Date().toISOString().slice(0, 10),
			endsOn: new Date().toISOString().slice(0, 10),
			boothFee: '60',
			otherCosts: '0',
			salesTax: '7.25',
			cashFloat: '100',
			cardFee: '2.6',
			helperDiscount: '10',
			openHours: '8'
		})
	);
});

describe('booth order through the orders module', () => {
	let ref = '';

	it('writes the order, its line snapshot, its history and the deposit entry; e-mails the buyer', async () => {
		const o = boothOrder(1);
		const r = await placeBoothOrder(fairId, o, helper, 'http://shop.test');
		expect(r.status).toBe('accepted');
		ref = (r as { ref: string }).ref;
		const [order] = await db.select().from(s.orders).where(eq(s.orders.ref, ref));
		// 20.00 at 7.25 % sales tax added = 21.45; deposit 10.00 leaves 11.45 (worked by hand,
		// common practice: tax added to the tag price).
		expect(order).toMatchObject({
			status: 'deposit_held',
			giftNote: null,
			shippingMinor: 0,
			delivery: 'collect',
			totalMinor: 2145,
			depositMinor: 1000,
			balancePaidAt: null
		});
		expect(order.readyBy).toMatch(/^\d{4}-\d{2}-\d{2}$/);
		const lines = await db.select().from(s.orderLines).where(eq(s.orderLines.orderId, order.id));
		expect(lines).toHaveLength(1);
		const snap = lines[0].personalisation as s.Personalisation;
		expect(snap.initials).toBe('JR');
		expect(snap.estimateMinutes).toBeGreaterThan(0);
		const history = await db
			.select()
			.from(s.orderHistory)
			.where(eq(s.orderHistory.orderId, order.id));
		expect(history).toMatchObject([
			{ fromStatus: 'pending', toStatus: 'deposit_held', userId: helper.id }
		]);
		const [entry] = await db.select().from(s.boothSales).where(eq(s.boothSales.id, o.id));
		expect(entry).toMatchObject({ kind: 'deposit', orderId: order.id, totalMinor: 1000 });

		const mail = await mailTo(o.email, new RegExp(ref));
		expect(mail.text).toContain('Deposit paid: $10.00');
		expect(mail.text).toContain('Left to pay before it ships: $11.45');
		expect(mail.text).toContain(`http://shop.test/orders/${ref}?k=`);
		expect(mail.html).toContain('$11.45');
	});

	it('queues one owner alert and one buyer letter with the order, also when it is posted twice at once', async () => {
		const o = boothOrder(40);
		const both = await Promise.all([
			placeBoothOrder(fairId, o, helper, 'http://shop.test'),
			placeBoothOrder(fairId, o, helper, 'http://shop.test')
		]);
		expect(both.map((r) => r.status).sort()).toEqual(['accepted', 'duplicate']);
		const again = await placeBoothOrder(fairId, o, helper, 'http://shop.test');
		expect(again.status).toBe('duplicate');
		const { ref } = both.find((r) => r.status === 'accepted') as { ref: string };
		const rows = await db
			.select()
			.from(s.outbox)
			.where(like(s.outbox.subject, `%${ref}%`));
		const buyer = rows.filter((r) => r.recipients === o.email);
		const alert = rows.filter((r) => r.recipients !== o.email);
		expect(buyer).toHaveLength(1);
		expect(alert).toHaveLength(1);
		expect(alert[0].recipients).toContain(owner.email);
		// Written with the order, so both state the ready-by day it was given in that transaction.
		const [order] = await db.select().from(s.orders).where(eq(s.orders.ref, ref));
		expect(order.promisedBy).not.toBeNull();
		const ordered = await mailTo(o.email, new RegExp(ref));
		expect(ordered.subject).toContain(ref);
	});

	it('refuses a deposit above the total and writes nothing', async () => {
		const o = boothOrder(2, { depositMinor: 2146 });
		await expect(placeBoothOrder(fairId, o, helper)).rejects.toBeInstanceOf(DomainError);
		expect(await db.select().from(s.orders).where(eq(s.orders.email, o.email))).toEqual([]);
		expect(await db.select().from(s.boothSales).where(eq(s.boothSales.id, o.id))).toEqual([]);
	});

	it('cannot ship with the balance owed: 409 from the API and the form, nothing written', async () => {
		const [order] = await db.select().from(s.orders).where(eq(s.orders.ref, ref));
		for (const to of ['carving', 'finishing', 'packed'] as const)
			await moveOrder(order.id, to, { userId: owner.id, why: 'test' });
		const api = await shipJson(ref);
		expect(api.status).toBe(409);
		expect(((await api.json()) as { error: string }).error).toMatch(/\$11\.45 to pay/);
		const form = await call('ship', ref, {
			carrier: 'USPS',
			trackingNumber: '9400111899223344556677'
		});
		expect(form.status).toBe(409);
		expect(await db.select().from(s.shipments).where(eq(s.shipments.orderId, order.id))).toEqual(
			[]
		);
		const [still] = await db.select().from(s.orders).where(eq(s.orders.id, order.id));
		expect(still.status).toBe('packed');
	});

	it('records the balance once under two clicks; helpers and bad input refused; then it ships', async () => {
		await expect(call('balance', ref, { method: 'cash' }, 'helper')).rejects.toMatchObject({
			status: 403
		});
		expect((await call('balance', ref, { method: 'cheque' })).status).toBe(400);
		const both = await Promise.all([
			call('balance', ref, { method: 'card' }),
			call('balance', ref, { method: 'card' })
		]);
		expect(both.filter((r) => r.done)).toHaveLength(1);
		expect(both.filter((r) => r.status === 409)).toHaveLength(1);
		const [order] = await db.select().from(s.orders).where(eq(s.orders.ref, ref));
		expect(order.balanceMethod).toBe('card');
		expect(order.balancePaidAt).not.toBeNull();
		const notes = await db
			.select()
			.from(s.orderHistory)
			.where(and(eq(s.orderHistory.orderId, order.id), eq(s.orderHistory.toStatus, 'packed')));
		expect(notes.filter((h) => /Balance of \$11\.45 paid by card/.test(h.reason))).toHaveLength(1);
		const api = await shipJson(ref);
		expect(api.status).toBe(201);
	});
});
