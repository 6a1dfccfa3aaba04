/**
 * A buyer writes to the shop about their order, from the order page: one e-mail to the owner
 * with the order's reference in the subject and a link to it in the workshop, the buyer's
 * address as Reply-To so the owner simply answers. Throttled per order and per client address
 * (counted in MariaDB, so every app process shares the limit) and sent through the outbox, so a
 * mail server that is down only delays it.
 */
import { eq } from 'drizzle-orm';
import { db } from '../db';
import { users } from '../db/schema';
import { sendMail } from '../mail/send';
import { esc, mailButton, mailPage } from '../mail/html';
import { takeAll, type Verdict } from '../http/rate-limit';
import { throttles } from '../http/throttles';

type From = { ref: string; buyerName: string; email: string };

export function orderMessageMail(order: From, body: string, origin: string) {
	const href = `${origin}/workshop/orders/${encodeURIComponent(order.ref)}`;
	const text = [
		`${order.buyerName} (${order.email}) wrote about order ${order.ref}:`,
		'',
		body,
		'',
		`Answer this e-mail to reply to them. The order: ${href}`
	].join('\n');
	const html =
		mailPage(`<h1 style="font-size:22px;margin:0 0 8px">About order ${esc(order.ref)}</h1>
<p>${esc(order.buyerName)} (${esc(order.email)}) wrote:</p>
<blockquote style="margin:0 0 16px;padding:8px 12px;border-left:4px solid #9a4a22;background:#fffaf2;white-space:pre-line">${esc(body)}</blockquote>
<p>Answer this e-mail to reply to them.</p>
${mailButton(href, 'Open the order')}`);
	return { subject: `Message about order ${order.ref} from ${order.buyerName}`, text, html };
}

/** Sends the message, or says how long to wait when this order or address wrote too often. */
export async function messageShop(
	order: From,
	body: string,
	clientAddress: string,
	origin: string
): Promise<Verdict> {
	const verdict = await takeAll([
		[throttles.orderMessage, order.ref],
		[throttles.orderMessageAddress, clientAddress]
	]);
	if (!verdict.ok) return verdict;
	const owners = await db.select({ email: users.email }).from(users).where(eq(users.role, 'owner'));
	await sendMail({
		to: owners.map((o) => o.email),
		replyTo: order.email,
		...orderMessageMail(order, body, origin)
	});
	return verdict;
}
