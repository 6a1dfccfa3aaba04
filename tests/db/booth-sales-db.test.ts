/**
 * Booth sales against the real MariaDB and the mail stand-in: the same id with other content is
 * a conflict; a void puts stock back and takes the sale out of the takings; a sale made before
 * the close arrives after it and counts, marked late; dates outside the fair are refused; a
 * split payment and a receipt; a posted booth order charges postage and files its tax under the
 * fair's place. Amounts are worked by hand (tax added to the tag, half-up, common practice).
 */
import { and, eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import { demoStaff, mailTo, testPiece, testStock, testWood } from '../helpers/fixtures';
import { createFair } from '$lib/server/fairs/fairs';
import { loadOut } from '$lib/server/fairs/load-out';
import { syncSales } from '$lib/server/booth/sync';
import { voidSale } from '$lib/server/booth/void';
import { placeBoothOrder } from '$lib/server/booth/order';
import { closeFair, fairTally } from '$lib/server/booth/tally';
import { fairCsv, fairReport } from '$lib/server/booth/fair-report';
import { moneyReport } from '$lib/server/booth/money-report';
import { getShopInfo } from '$lib/server/settings/shop-settings';
import { fairFormSchema } from '$lib/fairs/schemas';
import { syncAnswerSchema } from '$lib/booth/sync-message';
import { DomainError } from '$lib/server/errors/domain-error';

const tag = `bs${process.pid}${Date.now() % 100000}`;
let pieceId = 0;
let woodId = 0;
let fairId = 0;
let owner: { id: string; role: 'owner' };
let helper: { id: string; role: 'helper' };
const pieceSlug = `${tag}-orn`;
const woodSlug = `${tag}-wood`;
const today = new Date().toISOString().slice(0, 10);

async function qty(place: string) {
	const [row] = await db
		.select({ q: s.stock.quantity })
		.from(s.stock)
		.where(and(eq(s.stock.pieceId, pieceId), eq(s.stock.woodId, woodId), eq(s.stock.place, place)));
	return row?.q ?? 0;
}

// One time for every sale here: a resend carries the time it was made, like the phone's.
const AT = new Date(Date.now() - 60_000).toISOString();
const sale = (n: number, extra: Record<string, unknown> = {}) => ({
	id: `${tag}-sale-${n}`,
	at: AT,
	lines: [{ pieceSlug, woodSlug, quantity: 1 }],
	discountMinor: 0,
	method: 'cash',
	tenderedMinor: 5000,
	...extra
});

async function newFair(name: string, startsOn = today, endsOn = today) {
	return createFair(
		fairFormSchema.parse({
			name,
			place: `${tag} Hall, Łódź`,
			startsOn,
			endsOn,
			boothFee: '60',
			otherCosts: '0',
			salesTax: '7.25',
			cashFloat: '100',
			cardFee: '0',
			helperDiscount: '10',
			openHours: '8'
		})
	);
}

beforeAll(async () => {
	woodId = await testWood(woodSlug);
	pieceId = await testPiece(pieceSlug, [woodId], {
		title: 'Test ornament',
		kind: 'ornament',
		personalisable: true
	});
	await testStock(pieceId, woodId, 20);
	({ owner, helper } = await demoStaff());
	fairId = await newFair(`${tag} fair`);
	await loadOut(fairId, [{ pieceId, woodId, quantity: 10 }], owner.id);
});

describe('one id, one sale', () => {
	it('a resend is a duplicate; the same id with other content is a conflict, not stored', async () => {
		expect((await syncSales(fairId, [sale(1)], helper)).accepted).toEqual([sale(1).id]);
		expect((await syncSales(fairId, [sale(1)], helper)).duplicate).toEqual([sale(1).id]);
		const other = await syncSales(
			fairId,
			[sale(1, { lines: [{ pieceSlug, woodSlug, quantity: 3 }] })],
			helper
		);
		expect(other.duplicate).toEqual([]);
		expect(other.rejected).toMatchObject([{ id: sale(1).id, conflict: true }]);
		// The answer is the one message type the phone reads (strict: no field the phone ignores).
		expect(syncAnswerSchema.strict().parse(other)).toEqual(other);
		const [row] = await db
			.select()
			.from(s.boothSales)
			.where(eq(s.boothSales.id, sale(1).id));
		expect(row.lines[0].quantity).toBe(1);
		expect(await qty(`fair:${fairId}`)).toBe(9);
	});

	it('refuses sales dated 1999 and sales at a fair that starts next March, with reasons', async () => {
		const old = await syncSales(fairId, [sale(2, { at: '1999-06-01T10:00:00Z' })], helper);
		expect(old.rejected[0].error).toMatch(/dated 1999-06-01, before/);
		const march = await newFair(`${tag} spring`, '2099-03-06', '2099-03-07');
		await loadOut(march, [{ pieceId, woodId, quantity: 1 }], owner.id);
		const early = await syncSales(march, [sale(3)], helper);
		expect(early.rejected[0].error).toMatch(/before .* starts \(2099-03-06\)/);
		expect(await db.select().from(s.boothSales).where(eq(s.boothSales.fairId, march))).toEqual([]);
	});
});

describe('void', () => {
	it('a helper voids today’s sale with a reason: stock back, out of takings, shown with who', async () => {
		await syncSales(fairId, [sale(10, { method: 'card', tenderedMinor: null })], helper);
		const before = await fairTally(fairId);
		const stockBefore = await qty(`fair:${fairId}`);
		const v = {
			id: `${tag}-void-10`,
			saleId: sale(10).id,
			at: new Date().toISOString(),
			reason: 'Double tap'
		};
		expect(await voidSale(fairId, v, helper)).toEqual({ status: 'voided' });
		expect(await voidSale(fairId, v, helper)).toEqual({ status: 'duplicate' });
		expect(await qty(`fair:${fairId}`)).toBe(stockBefore + 1);
		const after = await fairTally(fairId);
		// One card sale of 20.00 + 7.25 % = 21.45 leaves takings, tax (1.45) and the card total.
		expect(before.result.takings - after.result.takings).toBe(2145);
		expect(before.result.taxDue - after.result.taxDue).toBe(145);
		expect(before.result.card.recorded - after.result.card.recorded).toBe(2145);
		const r = await fairReport(fairId);
		expect(r.corrections.voids).toMatchObject([{ id: sale(10).id, reason: 'Double tap' }]);
		expect(r.corrections.voids[0].by).toBeTruthy();
		const csv = fairCsv(r);
		expect(csv).toMatch(new RegExp(`${sale(10).id},voided sale,voided,card`));
		const [row] = await db
			.select()
			.from(s.boothSales)
			.where(eq(s.boothSales.id, sale(10).id));
		expect(row.voidedBy).toBe(helper.id);
	});

	it('a helper cannot void a sale of another day; the owner can; a deposit is not voided here', async () => {
		await syncSales(fairId, [sale(11)], owner);
		const tomorrow = new Date(Date.now() + 86_400_000).toISOString();
		await expect(
			voidSale(
				fairId,
				{ id: `${tag}-void-11`, saleId: sale(11).id, at: tomorrow, reason: 'x' },
				helper,
				new Date(tomorrow)
			)
		).rejects.toMatchObject({ status: 403 });
		await expect(
			voidSale(
				fairId,
				{ id: `${tag}-void-11`, saleId: sale(11).id, at: tomorrow, reason: 'Returned' },
				owner,
				new Date(tomorrow)
			)
		).resolves.toEqual({ status: 'voided' });
		await expect(
			voidSale(
				fairId,
				{ id: `${tag}-void-x`, saleId: 'no-such-sale', at: tomorrow, reason: 'x' },
				owner
			)
		).rejects.toBeInstanceOf(DomainError);
	});
});

describe('split payment and receipt', () => {
	it('stores the card part, counts it on the reader, and e-mails the receipt', async () => {
		const email = `${tag}-receipt@example.test`;
		const before = await fairTally(fairId);
		const a = await syncSales(
			fairId,
			[
				sale(20, {
					lines: [{ pieceSlug, woodSlug, quantity: 2 }],
					cardPartMinor: 2000,
					tenderedMinor: 2290,
					receiptEmail: email
				})
			],
			helper
		);
		expect(a.accepted).toEqual([sale(20).id]);
		const after = await fairTally(fairId);
		// 40.00 + 7.25 % = 42.90: 20.00 by card, 22.90 in cash.
		expect(after.result.card.recorded - before.result.card.recorded).toBe(2000);
		expect(after.result.cash.takings - before.result.cash.takings).toBe(2290);
		const mail = await mailTo(email, /receipt/);
		expect(mail.text).toContain('$42.90');
		expect(mail.text).toContain('$22.90 in cash and $20.00 by card');
	});
});

describe('late sales', () => {
	it('a sale made before the close arrives after it: counted, marked late; resends stay duplicates', async () => {
		const f = await newFair(`${tag} late`);
		await loadOut(f, [{ pieceId, woodId, quantity: 3 }], owner.id);
		const made = new Date(Date.now() - 120_000).toISOString();
		const workshopBefore = await qty('workshop');
		await closeFair(f, owner.id);
		// Nobody counted: the close sent all 3 home; the late sale takes its piece from there.
		expect(await qty('workshop')).toBe(workshopBefore + 3);
		const a = await syncSales(f, [sale(30, { at: made })], helper);
		expect(a.accepted).toEqual([sale(30).id]);
		expect(a.late).toEqual([sale(30).id]);
		expect(await qty('workshop')).toBe(workshopBefore + 2);
		expect((await syncSales(f, [sale(30, { at: made })], helper)).duplicate).toEqual([sale(30).id]);
		const t = await fairTally(f);
		expect(t.lateSales).toBe(1);
		expect(t.result.takings).toBe(2145);
		expect(fairCsv(await fairReport(f))).toMatch(/,yes,/);
	});
});

describe('booth order posted', () => {
	it('charges postage from the shop’s rates and files its tax under the fair’s place', async () => {
		const o = {
			id: `${tag}-order-post`,
			at: new Date().toISOString(),
			pieceSlug,
			woodSlug,
			initials: 'LZ',
			name: 'Zofia Łęcka',
			email: `${tag}-post@example.test`,
			line1: '2 Lane',
			city: 'Boulder',
			region: 'CO',
			postcode: '80302',
			country: 'US',
			depositMinor: 1000,
			method: 'card' as const,
			delivery: 'post' as const
		};
		const r = await placeBoothOrder(fairId, o, helper, 'http://shop.test');
		expect(r.status).toBe('accepted');
		const [order] = await db.select().from(s.orders).where(eq(s.orders.email, o.email));
		expect(order.shippingMinor).toBeGreaterThan(0);
		expect(order.totalMinor).toBe(2145 + order.shippingMinor);
		expect(order.status).toBe('deposit_held');
		const again = placeBoothOrder(fairId, { ...o, depositMinor: 500 }, helper);
		await expect(again).rejects.toMatchObject({ status: 409 });
		const m = await moneyReport();
		expect(
			m.taxByPlace.find((p) => p.place === `Fair: ${tag} Hall, Łódź`)?.taxMinor
		).toBeGreaterThanOrEqual(order.taxMinor);
		expect(
			m.taxByPlace.some((p) => p.place === 'Online: CO, US' && p.taxMinor === order.taxMinor)
		).toBe(false);
		// Who took it is the person signed in; the shop's name comes from its settings.
		const [me] = await db.select().from(s.users).where(eq(s.users.id, helper.id));
		const shop = await getShopInfo();
		const mail = await mailTo(o.email, /Order/);
		expect(mail.text).toContain(`${me.name} took your order ${order.ref} for ${shop.name}`);
		expect(mail.text).toContain('Deposit paid: $10.00');
		// The workshop's alert says what was taken and what is still owed, not "paid".
		const [boss] = await db.select().from(s.users).where(eq(s.users.id, owner.id));
		const alert = await mailTo(boss.email, new RegExp(`New order ${order.ref}`));
		expect(alert.text).toContain('Deposit taken: $10.00');
		expect(alert.subject).toContain('still due');
	});
});
