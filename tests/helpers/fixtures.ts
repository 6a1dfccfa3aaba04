/**
 * Small rows the database tests make for themselves (a wood, a piece offered in it, stock on the
 * shelf, an account, an order with its lines) under a tag of their own, the demo's staff, and
 * reading a message back from the mail stand-in with a general-purpose parser. Each takes the
 * values a test cares about; the rest are plain defaults.
 */
import { simpleParser } from 'mailparser';
import { and, eq } from 'drizzle-orm';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import type { PieceKind } from '$lib/catalogue/kinds';
import { config } from '$lib/server/config';
import { stripe } from '$lib/server/orders/stripe';
import { addLine } from '$lib/server/cart';

type WoodRow = typeof s.woods.$inferInsert;
type PieceRow = typeof s.pieces.$inferInsert;
type OrderRow = typeof s.orders.$inferInsert;
type LineRow = typeof s.orderLines.$inferInsert;

/** Basswood by default (Wood Handbook, FPL-GTR-190, table 5-3a: SG 0.37, side hardness 1.8 kN). */
export async function testWood(slug: string, o: Partial<WoodRow> = {}) {
	const [{ id }] = await db
		.insert(s.woods)
		.values({
			slug,
			name: `Wood ${slug}`,
			botanicalName: 'Tilia americana',
			specificGravityMilli: 370,
			densityKgM3: 414,
			sideHardnessN: 1800,
			priceAddOnMinor: 0,
			toneLight: '#f1e4c8',
			toneDark: '#c9ae82',
			character: 'test',
			...o
		})
		.$returningId();
	return id;
}

/** A 75 × 75 × 6 mm piece at 20.00 in `woodIds`, carved to order or not; `o` changes the rest. */
export async function testPiece(
	slug: string,
	woodIds: number[],
	o: { title: string; kind: PieceKind; personalisable: boolean } & Partial<PieceRow>
) {
	const [{ id }] = await db
		.insert(s.pieces)
		.values({
			slug,
			summary: 'test',
			description: 'test',
			lengthMm: 75,
			widthMm: 75,
			thicknessMm: 6,
			basePriceMinor: 2000,
			leadDays: 10,
			pattern: { diameterMm: 50, count: 1 },
			createdAt: new Date(),
			...o
		})
		.$returningId();
	if (woodIds.length)
		await db.insert(s.pieceWoods).values(woodIds.map((woodId) => ({ pieceId: id, woodId })));
	return id;
}

/** `quantity` of the piece in that wood on a shelf (the workshop's unless `place` says). */
export async function testStock(
	pieceId: number,
	woodId: number,
	quantity: number,
	place = 'workshop'
) {
	await db.insert(s.stock).values({ pieceId, woodId, place, quantity });
}

/** On the workshop shelf now, for the piece in that wood. */
export async function shelfCount(pieceId: number, woodId: number) {
	const [row] = await db
		.select({ q: s.stock.quantity })
		.from(s.stock)
		.where(
			and(eq(s.stock.pieceId, pieceId), eq(s.stock.woodId, woodId), eq(s.stock.place, 'workshop'))
		);
	return row.q;
}

/** A fresh basket holding one of `<tag>-piece` in `<tag>-wood`, through the app's own addLine. */
export async function testCart(tag: string) {
	const id = crypto.randomUUID();
	const now = new Date();
	await db.insert(s.carts).values({ id, createdAt: now, updatedAt: now });
	await addLine(id, { slug: `${tag}-piece`, wood: `${tag}-wood`, quantity: 1 });
	return id;
}

/** The seeded owner and helper (scripts/seed/data/accounts.ts), as the booth and fair code takes them. */
export async function demoStaff() {
	const users = await db.select({ id: s.users.id, role: s.users.role }).from(s.users);
	const idOf = (role: 'owner' | 'helper') => {
		const u = users.find((x) => x.role === role);
		if (!u) throw new Error(`the test database has no ${role}: was it seeded?`);
		return u.id;
	};
	return {
		owner: { id: idOf('owner'), role: 'owner' as const },
		helper: { id: idOf('helper'), role: 'helper' as const }
	};
}

/** An account with a random id and an unusable password hash (it never signs in). */
export async function testUser(email: string, role: 'owner' | 'helper' | 'customer', name = email) {
	const id = crypto.randomUUID();
	await db
		.insert(s.users)
		.values({ id, email, name, passwordHash: 'x', role, createdAt: new Date() });
	return { id, role };
}

/**
 * An order straight in the database: paid, in US dollars, to a US address, for `totalMinor`
 * (4000 unless given) without shipping, unless `o` says otherwise; with `lines`, if any.
 */
export async function testOrder(
	o: Pick<OrderRow, 'ref' | 'email'> & Partial<OrderRow>,
	lines: Omit<LineRow, 'orderId'>[] = []
) {
	const total = o.totalMinor ?? 4000;
	const [{ id }] = await db
		.insert(s.orders)
		.values({
			buyerName: 'Test Buyer',
			address: { line1: '1 Mill St', city: 'Testville', postcode: '05001', country: 'US' },
			currency: 'USD',
			subtotalMinor: total,
			shippingMinor: 0,
			totalMinor: total,
			status: 'paid',
			createdAt: new Date(),
			...o
		})
		.$returningId();
	if (lines.length) await db.insert(s.orderLines).values(lines.map((l) => ({ ...l, orderId: id })));
	return id;
}

/** One line: a piece in a wood at `totalMinor`, taken from stock unless `o` says otherwise. */
export function testLine(
	pieceId: number,
	woodId: number,
	totalMinor: number,
	o: Partial<Omit<LineRow, 'orderId'>> = {}
): Omit<LineRow, 'orderId'> {
	return {
		pieceId,
		woodId,
		title: 'Test plate',
		woodName: 'Test wood',
		quantity: 1,
		unitPriceMinor: totalMinor,
		lineTotalMinor: totalMinor,
		fromStock: true,
		...o
	};
}

/**
 * A real payment at the payment stand-in, for an order a test refunds: a checkout session made
 * with the SDK and paid on its card page (4242 4242 4242 4242, Stripe's test card that
 * succeeds); returns its payment intent.
 */
export async function paidIntent(amountMinor: number) {
	const sdk = stripe();
	const session = await sdk.checkout.sessions.create({
		mode: 'payment',
		line_items: [
			{
				quantity: 1,
				price_data: {
					currency: 'usd',
					unit_amount: amountMinor,
					product_data: { name: 'Test plate' }
				}
			}
		],
		success_url: 'http://localhost/done?session_id={CHECKOUT_SESSION_ID}'
	});
	await fetch(session.url!, {
		method: 'POST',
		body: new URLSearchParams({
			number: '4242 4242 4242 4242',
			expiry: '12/39',
			cvc: '123',
			name: 'Test Buyer'
		}),
		redirect: 'manual'
	});
	return (await sdk.checkout.sessions.retrieve(session.id)).payment_intent as string;
}

const inbox = () => `http://127.0.0.1:${config.mail.inboxPort}/api/messages`;

/** The first message to `email` whose subject matches, parsed with mailparser; waits up to 5 s. */
export async function mailTo(email: string, subject: RegExp) {
	for (let i = 0; i < 100; i++) {
		const list = (await (await fetch(`${inbox()}?to=${encodeURIComponent(email)}`)).json()) as {
			id: string;
			subject: string;
		}[];
		const m = list.find((x) => subject.test(x.subject));
		if (m)
			return simpleParser(Buffer.from(await (await fetch(`${inbox()}/${m.id}/raw`)).arrayBuffer()));
		await new Promise((r) => setTimeout(r, 50));
	}
	throw new Error(`no mail to ${email} matching ${subject}`);
}
