import { randomInt } from 'node:crypto';
import { and, desc, eq, gte, inArray, isNotNull, lt, sql } from 'drizzle-orm';
import { db, type Tx } from './db';
import {
	cartLines,
	carts,
	orderLines,
	orders,
	pieces,
	processedEvents,
	shipments,
	stock,
	type Address,
	type Personalisation
} from './db/schema';
import { jsonValue } from './json-column';
import { leadDaysFor, priceCart, WORKSHOP } from './pricing';
import type { CheckoutInput } from '$lib/schemas/checkout';

/** A checkout that cannot go ahead; the message is for the buyer. */
export class OrderError extends Error {
	constructor(
		message: string,
		public status = 409,
		public code: 'empty' | 'stock' | 'price' | 'rates' | 'unknown' = 'unknown'
	) {
		super(message);
	}
}

/** Stripe lets a Checkout Session live 30 min to 24 h; a little over 30 covers clock drift. */
export const HOLD_MINUTES = 35;

const REF_ALPHABET = '23456789ABCDEFGHJKMNPQRSTVWXYZ'; // no 0/O, 1/I/L, U: easy to read aloud

export function newOrderRef(): string {
	let s = '';
	for (let i = 0; i < 6; i++) s += REF_ALPHABET[randomInt(REF_ALPHABET.length)];
	return `CS-${s}`;
}

/** ISO date `days` after `from` (UTC calendar days). */
export function addDays(from: Date, days: number): string {
	const d = new Date(Date.UTC(from.getUTCFullYear(), from.getUTCMonth(), from.getUTCDate()));
	d.setUTCDate(d.getUTCDate() + days);
	return d.toISOString().slice(0, 10);
}

/** Takes `qty` finished pieces off the workshop shelf, never below zero (row locked). */
async function takeStock(tx: Tx, pieceId: number, woodId: number, qty: number): Promise<boolean> {
	const [row] = await tx
		.select({ id: stock.id, quantity: stock.quantity })
		.from(stock)
		.where(and(eq(stock.pieceId, pieceId), eq(stock.woodId, woodId), eq(stock.place, WORKSHOP)))
		.for('update');
	if (!row || row.quantity < qty) return false;
	await tx
		.update(stock)
		.set({ quantity: sql`${stock.quantity} - ${qty}` })
		.where(and(eq(stock.id, row.id), gte(stock.quantity, qty)));
	return true;
}

async function putBackStock(tx: Tx, pieceId: number, woodId: number, qty: number) {
	const [row] = await tx
		.select({ id: stock.id })
		.from(stock)
		.where(and(eq(stock.pieceId, pieceId), eq(stock.woodId, woodId), eq(stock.place, WORKSHOP)))
		.for('update');
	if (row) {
		await tx
			.update(stock)
			.set({ quantity: sql`${stock.quantity} + ${qty}` })
			.where(eq(stock.id, row.id));
	} else {
		await tx.insert(stock).values({ pieceId, woodId, place: WORKSHOP, quantity: qty });
	}
}

/**
 * Turns the cart into a pending order in one transaction: every price, tax and shipping charge
 * recomputed from the database, finished pieces held by taking them off the shelf (locked rows),
 * held until the payment session expires.
 */
export async function createPendingOrder(
	cartId: string,
	buyer: CheckoutInput,
	userId: string | null,
	now = new Date()
) {
	return db.transaction(async (tx) => {
		// Lock the cart so a double-submitted form cannot turn one cart into two orders at once.
		const [cart] = await tx
			.select({ id: carts.id })
			.from(carts)
			.where(eq(carts.id, cartId))
			.for('update');
		if (!cart) throw new OrderError('Your basket is empty.', 409, 'empty');

		const priced = await priceCart(cartId, buyer.country, tx);
		if (priced.lines.length === 0) throw new OrderError('Your basket is empty.', 409, 'empty');
		if (!priced.shippingKnown) throw new OrderError(priced.problems.at(-1)!.message, 409, 'rates');
		const blocking = priced.problems.filter((p) => p.lineId !== 0);
		if (blocking.length)
			throw new OrderError(blocking.map((p) => p.message).join(' '), 409, 'stock');
		if (buyer.seenTotal !== undefined && buyer.seenTotal !== priced.totalMinor) {
			throw new OrderError(
				'The total has changed since you opened this page. Please check the new total and pay again.',
				409,
				'price'
			);
		}

		for (const line of priced.lines.filter((l) => l.fromStock)) {
			if (!(await takeStock(tx, line.pieceId, line.woodId, line.quantity))) {
				throw new OrderError(`${line.title} in ${line.woodName} has just sold out.`, 409, 'stock');
			}
		}

		let ref = newOrderRef();
		for (let i = 0; i < 5; i++) {
			const [clash] = await tx.select({ id: orders.id }).from(orders).where(eq(orders.ref, ref));
			if (!clash) break;
			ref = newOrderRef();
		}
		const holdExpiresAt = new Date(now.getTime() + HOLD_MINUTES * 60_000);
		const address: Address = {
			line1: buyer.line1,
			...(buyer.line2 ? { line2: buyer.line2 } : {}),
			city: buyer.city,
			...(buyer.region ? { region: buyer.region.toUpperCase() } : {}),
			postcode: buyer.postcode,
			country: buyer.country
		};
		const [{ id }] = await tx
			.insert(orders)
			.values({
				ref,
				userId,
				cartId,
				email: buyer.email,
				buyerName: buyer.name,
				address,
				giftNote: buyer.giftNote || null,
				currency: priced.currency,
				subtotalMinor: priced.subtotalMinor,
				shippingMinor: priced.shippingMinor,
				taxMinor: priced.taxMinor,
				totalMinor: priced.totalMinor,
				status: 'pending',
				readyBy: addDays(now, leadDaysFor(priced.lines)),
				holdExpiresAt,
				createdAt: now
			})
			.$returningId();
		await tx.insert(orderLines).values(
			priced.lines.map((l) => ({
				orderId: id,
				pieceId: l.pieceId,
				woodId: l.woodId,
				title: l.title,
				woodName: l.woodName,
				quantity: l.quantity,
				unitPriceMinor: l.unitMinor,
				lineTotalMinor: l.totalMinor,
				fromStock: l.fromStock,
				personalisation: l.personalisation
			}))
		);
		return { id, ref, holdExpiresAt, priced };
	});
}

export async function attachCheckoutSession(orderId: number, sessionId: string) {
	await db.update(orders).set({ checkoutSessionId: sessionId }).where(eq(orders.id, orderId));
}

async function releaseInTx(tx: Tx, orderId: number): Promise<boolean> {
	const [order] = await tx
		.select({ id: orders.id, status: orders.status })
		.from(orders)
		.where(eq(orders.id, orderId))
		.for('update');
	if (!order || order.status !== 'pending') return false;
	const held = await tx
		.select()
		.from(orderLines)
		.where(and(eq(orderLines.orderId, orderId), eq(orderLines.fromStock, true)));
	for (const l of held) await putBackStock(tx, l.pieceId, l.woodId, l.quantity);
	await tx
		.update(orders)
		.set({ status: 'cancelled', holdExpiresAt: null })
		.where(eq(orders.id, orderId));
	return true;
}

/** Puts held pieces back on the shelf and cancels a still-pending order; false if not pending. */
export async function releaseOrder(orderId: number) {
	return db.transaction((tx) => releaseInTx(tx, orderId));
}

/** Safety net for sessions whose expiry event never arrived. */
export async function releaseExpiredHolds(now = new Date()) {
	const stale = await db
		.select({ id: orders.id })
		.from(orders)
		.where(
			and(
				eq(orders.status, 'pending'),
				isNotNull(orders.holdExpiresAt),
				lt(orders.holdExpiresAt, now)
			)
		);
	for (const o of stale) await releaseOrder(o.id);
	return stale.length;
}

type PaidEvent = {
	eventId: string;
	type: string;
	sessionId: string;
	ref?: string;
	paymentIntentId?: string | null;
};

/** Records an event id; false when it was already handled (the same id arrives again). */
async function firstTime(tx: Tx, eventId: string, type: string) {
	const [seen] = await tx
		.select({ id: processedEvents.id })
		.from(processedEvents)
		.where(eq(processedEvents.id, eventId))
		.for('update');
	if (seen) return false;
	await tx.insert(processedEvents).values({ id: eventId, type, processedAt: new Date() });
	return true;
}

async function orderForSession(tx: Tx, sessionId: string, ref?: string) {
	const [order] = await tx
		.select()
		.from(orders)
		.where(ref ? eq(orders.ref, ref) : eq(orders.checkoutSessionId, sessionId))
		.for('update');
	return order;
}

/**
 * Payment completed: in one transaction record the event, mark the order paid, turn the hold
 * into a sale (the pieces already left the shelf) and empty the cart. Personalised lines are
 * queued for carving by the order's `paid` status. Returns the order id to confirm by e-mail,
 * or null when nothing changed (repeat event, unknown order, already paid).
 */
export async function markPaid(e: PaidEvent, now = new Date()): Promise<number | null> {
	try {
		return await db.transaction(async (tx) => {
			if (!(await firstTime(tx, e.eventId, e.type))) return null;
			const order = await orderForSession(tx, e.sessionId, e.ref);
			if (!order || (order.status !== 'pending' && order.status !== 'cancelled')) return null;
			if (order.status === 'cancelled') {
				// The hold lapsed before the payment landed: take the pieces again if still there.
				const lines = await tx
					.select()
					.from(orderLines)
					.where(and(eq(orderLines.orderId, order.id), eq(orderLines.fromStock, true)));
				for (const l of lines) await takeStock(tx, l.pieceId, l.woodId, l.quantity);
			}
			const lines = await tx.select().from(orderLines).where(eq(orderLines.orderId, order.id));
			const lead = Math.max(
				0,
				...(await leadDaysOf(
					tx,
					lines.filter((l) => !l.fromStock).map((l) => l.pieceId)
				))
			);
			await tx
				.update(orders)
				.set({
					status: 'paid',
					paidAt: now,
					holdExpiresAt: null,
					checkoutSessionId: e.sessionId,
					paymentIntentId: e.paymentIntentId ?? null,
					readyBy: addDays(now, lead)
				})
				.where(eq(orders.id, order.id));
			if (order.cartId) await tx.delete(cartLines).where(eq(cartLines.cartId, order.cartId));
			return order.id;
		});
	} catch (err) {
		// Two deliveries of one event racing: the loser's insert hits the primary key.
		if ((err as { code?: string }).code === 'ER_DUP_ENTRY') return null;
		throw err;
	}
}

async function leadDaysOf(tx: Tx, pieceIds: number[]) {
	if (pieceIds.length === 0) return [];
	const rows = await tx
		.select({ d: pieces.leadDays })
		.from(pieces)
		.where(inArray(pieces.id, pieceIds));
	return rows.map((r) => r.d);
}

/** Session expired unpaid: record the event and release the hold, in one transaction. */
export async function markExpired(e: PaidEvent): Promise<boolean> {
	try {
		return await db.transaction(async (tx) => {
			if (!(await firstTime(tx, e.eventId, e.type))) return false;
			const order = await orderForSession(tx, e.sessionId, e.ref);
			if (!order) return false;
			return releaseInTx(tx, order.id);
		});
	} catch (err) {
		if ((err as { code?: string }).code === 'ER_DUP_ENTRY') return false;
		throw err;
	}
}

/** The order with its lines and shipments, for the buyer's page and the e-mail. */
export async function orderByRef(ref: string) {
	const [order] = await db.select().from(orders).where(eq(orders.ref, ref));
	if (!order) return null;
	return withDetails(order);
}

export async function orderById(id: number) {
	const [order] = await db.select().from(orders).where(eq(orders.id, id));
	return order ? withDetails(order) : null;
}

export async function orderBySession(sessionId: string) {
	const [order] = await db.select().from(orders).where(eq(orders.checkoutSessionId, sessionId));
	return order ? withDetails(order) : null;
}

async function withDetails(order: typeof orders.$inferSelect) {
	const [lines, ships] = await Promise.all([
		db.select().from(orderLines).where(eq(orderLines.orderId, order.id)).orderBy(orderLines.id),
		db
			.select()
			.from(shipments)
			.where(eq(shipments.orderId, order.id))
			.orderBy(desc(shipments.shippedAt))
	]);
	return {
		...order,
		address: jsonValue<Address>(order.address),
		lines: lines.map((l) => ({
			...l,
			personalisation: l.personalisation ? jsonValue<Personalisation>(l.personalisation) : null
		})),
		shipments: ships
	};
}

export type OrderDetail = NonNullable<Awaited<ReturnType<typeof orderByRef>>>;

/** A signed-in buyer's orders, newest first (abandoned checkouts left out). */
export async function ordersForUser(userId: string) {
	return db
		.select({
			ref: orders.ref,
			status: orders.status,
			totalMinor: orders.totalMinor,
			currency: orders.currency,
			createdAt: orders.createdAt,
			readyBy: orders.readyBy
		})
		.from(orders)
		.where(and(eq(orders.userId, userId), sql`${orders.status} not in ('pending', 'cancelled')`))
		.orderBy(desc(orders.createdAt), desc(orders.id));
}

/** The workshop's first order list: every order that got past checkout, newest first. */
export async function workshopOrders(limit = 200) {
	return db
		.select({
			ref: orders.ref,
			buyerName: orders.buyerName,
			email: orders.email,
			totalMinor: orders.totalMinor,
			currency: orders.currency,
			status: orders.status,
			createdAt: orders.createdAt,
			readyBy: orders.readyBy,
			personalised:
				sql<number>`(select count(*) from ${orderLines} where ${orderLines.orderId} = ${orders.id} and ${orderLines.personalisation} is not null)`.mapWith(
					Number
				)
		})
		.from(orders)
		.orderBy(desc(orders.createdAt), desc(orders.id))
		.limit(limit);
}
