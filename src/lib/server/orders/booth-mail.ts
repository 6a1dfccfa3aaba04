/**
 * The buyer's confirmation for an order taken at a fair: what will be carved, the deposit taken,
 * what is left to pay before it ships, and the signed link to follow it. Plain text and HTML carry
 * the same facts. Sent through the outbox like every other message.
 */
import { formatMoney } from '$lib/locale/money';
import { buyerReadyBy } from '$lib/queue/carving-queue';
import { orderBalance } from '$lib/orders/balance';
import { eq } from 'drizzle-orm';
import { db, type Tx } from '../db';
import { users } from '../db/schema';
import { queueMail } from '../mail/outbox';
import { getShopInfo } from '../settings/shop-settings';
import { promiseReadyBy } from '../queue/carving-queue';
import { esc, mailButton, mailPage } from '../mail/html';
import { queueNewOrderAlert } from './paid-alert';
import { orderLink } from './links';
import { readyByWords } from '$lib/orders/ready-by-words';
import { orderById, type OrderDetail } from './views';

export function boothOrderMail(
	order: OrderDetail,
	where: string,
	who: { takenBy: string; shop: string },
	origin?: string
) {
	const money = (m: number) => formatMoney(m, order.currency);
	const b = orderBalance(order);
	const link = orderLink(order.ref, origin);
	const lines = order.lines.map(
		(l) =>
			`${l.quantity} × ${l.title} in ${l.woodName}${l.personalisation ? `, initials ${l.personalisation.initials}` : ''}`
	);
	const facts: [string, string][] = [
		...(order.shippingMinor ? [['Postage', money(order.shippingMinor)] as [string, string]] : []),
		['Total', money(order.totalMinor)],
		['Deposit paid', money(b.depositMinor ?? 0)],
		['Left to pay before it ships', money(b.balanceMinor)]
	];
	const collect = order.delivery === 'collect';
	const rest =
		b.balanceMinor > 0
			? `We will be in touch to settle the ${money(b.balanceMinor)} left before we ${collect ? 'hand it over' : 'post it'}.`
			: 'It is paid in full.';
	const text = [
		`Thank you, ${order.buyerName}.`,
		'',
		`${who.takenBy} took your order ${order.ref} for ${who.shop} at ${where}:`,
		...lines.map((l) => `   ${l}`),
		'',
		...facts.map(([k, v]) => `${k}: ${v}`),
		'',
		`It should be ready to ${collect ? 'collect' : 'post'} by ${readyByWords(buyerReadyBy(order))}. ${rest}`,
		'',
		`See your order at any time: ${link}`
	].join('\n');
	const html = mailPage(`<p>Thank you, ${esc(order.buyerName)}.</p>
<p>${esc(who.takenBy)} took your order <strong>${esc(order.ref)}</strong> for ${esc(who.shop)} at ${esc(where)}:</p>
<ul>${lines.map((l) => `<li>${esc(l)}</li>`).join('')}</ul>
<table>${facts.map(([k, v]) => `<tr><td style="padding:2px 12px 2px 0">${esc(k)}</td><td style="text-align:right"><strong>${esc(v)}</strong></td></tr>`).join('')}</table>
<p>It should be ready to ${collect ? 'collect' : 'post'} by <strong>${esc(readyByWords(buyerReadyBy(order)))}</strong>. ${esc(rest)}</p>
${mailButton(link, 'See your order')}`);
	return { subject: `Order ${order.ref}: your order from ${where}`, text, html };
}

/** Who took the order and for which shop, as the buyer's letter names them. */
export async function boothOrderSigners(takenById: string) {
	const [shop, [taker]] = await Promise.all([
		getShopInfo(),
		db.select({ name: users.name }).from(users).where(eq(users.id, takenById))
	]);
	return { takenBy: taker?.name ?? shop.name, shop: shop.name };
}

/**
 * Inside the transaction that writes a booth order: the queue dates it, then the workshop's
 * alert (as for any paid order) and the buyer's confirmation are queued, both stating that
 * ready-by day. They exist exactly when the order does; a resent order (its booth entry already
 * stored) never gets here, so never queues them twice. Returns the outbox ids to send after
 * the commit (`sendQueued`).
 */
export async function queueBoothOrderLetters(
	tx: Tx,
	orderId: number,
	fairName: string,
	who: { takenBy: string; shop: string },
	now: Date,
	origin?: string
): Promise<number[]> {
	await promiseReadyBy(orderId, now, tx);
	const order = await orderById(orderId, tx);
	if (!order) return [];
	const alert = await queueNewOrderAlert(tx, orderId, origin ?? '');
	const buyer = await queueMail(tx, {
		to: order.email,
		...boothOrderMail(order, fairName, who, origin)
	});
	return [...alert, buyer];
}
