/**
 * The buyer's confirmation for an order taken at a fair: what will be carved, the deposit taken,
 * what is left to pay before it ships, and the signed link to follow it. Plain text and HTML carry
 * the same facts. Sent through the outbox like every other message.
 */
import { formatMoney } from '$lib/money';
import { buyerReadyBy } from '$lib/carving-queue';
import { orderBalance } from '$lib/order-balance';
import { eq } from 'drizzle-orm';
import { db } from '../db';
import { transact } from '../db/retry';
import { users } from '../db/schema';
import { queueMail, sendQueued } from '../mail/outbox';
import { getShopInfo } from '../shop-settings';
import { promiseReadyBy } from './carving-queue';
import { esc, mailButton, mailPage } from '../mail-html';
import { afterOrderPaid, queueNewOrderAlert } from './paid-alert';
import { orderLink } from './links';
import { readyByWords } from './mail';
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

/**
 * After a booth order is committed: the queue dates it (and the workshop hears of it, as for any
 * paid order), then the buyer gets the confirmation. A failed e-mail stays in the outbox and
 * never undoes the order.
 */
export async function afterBoothOrder(
	orderId: number,
	fairName: string,
	takenById: string,
	origin?: string
) {
	try {
		const [shop, [taker]] = await Promise.all([
			getShopInfo(),
			db.select({ name: users.name }).from(users).where(eq(users.id, takenById))
		]);
		const who = { takenBy: taker?.name ?? shop.name, shop: shop.name };
		// Dated, then both letters queued together: the workshop's alert and the buyer's
		// confirmation, stating the same ready-by day.
		const ids = await transact(async (tx) => {
			await promiseReadyBy(orderId, new Date(), tx);
			const order = await orderById(orderId, tx);
			if (!order) return [];
			const alert = await queueNewOrderAlert(tx, orderId, origin ?? '');
			const buyer = await queueMail(tx, {
				to: order.email,
				...boothOrderMail(order, fairName, who, origin)
			});
			return [...alert, buyer];
		});
		await sendQueued(ids);
	} catch (err) {
		console.error('booth order e-mail failed', orderId, err);
	}
	await afterOrderPaid(orderId);
}
