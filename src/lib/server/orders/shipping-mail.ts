import { workshopWords } from '$lib/locale/shop-format';
/**
 * The e-mails the workshop's order work sends: the buyer's "on its way" and "refunded" letters,
 * and the workshop's own alert for each paid order. Each has a text and an HTML part carrying
 * the same facts.
 */
import { formatMoney } from '$lib/locale/money';
import { trackingLink } from './tracking';
import { esc, mailButton, mailPage } from '../mail/html';
import { orderLink } from './links';
import { readyByWords } from '$lib/orders/ready-by-words';
import { careForAll, LETTERS_CARE } from '$lib/catalogue/care';

export type MailOrder = {
	ref: string;
	buyerName: string;
	currency: string;
	totalMinor: number;
	/** Set for an order taken with a deposit: the deposit and the balance still owed. */
	depositMinor?: number;
	balanceMinor?: number;
	lines: {
		quantity: number;
		title: string;
		woodName: string;
		initials?: string | null;
		/** The piece's kind and food flag: they choose the care words (see $lib/catalogue/care). */
		kind: string;
		foodContact: boolean;
	}[];
};

/** The care words for these pieces, from the one care module: never food advice for display. */
function careLines(order: MailOrder): string[] {
	const care = careForAll(order.lines.map((l) => ({ ...l, personalised: !!l.initials })));
	return [
		...care.notes.map((c) => `${c.title} (${c.pieces.join(', ')}): ${c.text}`),
		...(care.letters ? [LETTERS_CARE] : [])
	];
}

const lineWords = (l: MailOrder['lines'][number]) =>
	`${l.quantity} × ${l.title} in ${l.woodName}${l.initials ? `, initials ${l.initials}` : ''}`;

export function shippingMail(
	order: MailOrder,
	shipment: { carrier: string; trackingNumber: string },
	origin?: string
) {
	const link = orderLink(order.ref, origin);
	const track = trackingLink(shipment.carrier, shipment.trackingNumber);
	const care = careLines(order);
	const text = [
		`Hello ${order.buyerName},`,
		'',
		`Your order ${order.ref} left ${workshopWords()} today.`,
		'',
		...order.lines.map(lineWords),
		'',
		`Carrier: ${shipment.carrier}`,
		`Tracking number: ${shipment.trackingNumber}`,
		...(track ? [`Follow the parcel: ${track}`] : []),
		'',
		`Your order: ${link}`,
		'',
		'Looking after your pieces',
		...care
	].join('\n');
	const html = mailPage(`<h1 style="font-size:24px;margin:0 0 8px">Your order is on its way</h1>
<p>Hello ${esc(order.buyerName)}, your order <strong>${esc(order.ref)}</strong> left ${esc(workshopWords())} today.</p>
<ul>${order.lines.map((l) => `<li>${esc(lineWords(l))}</li>`).join('')}</ul>
<p>Carrier: <strong>${esc(shipment.carrier)}</strong><br>Tracking number: <strong>${esc(shipment.trackingNumber)}</strong></p>
${track ? `<p><a href="${esc(track)}">Follow the parcel with ${esc(shipment.carrier)}</a></p>` : ''}
${mailButton(link, 'See your order')}
<h2 style="font-size:18px;margin:16px 0 4px">Looking after your pieces</h2>
${care.map((c) => `<p style="font-size:14px;margin:4px 0;color:#5c4a3c">${esc(c)}</p>`).join('\n')}`);
	return { subject: `Order ${order.ref} is on its way`, text, html };
}

export function refundMail(
	order: MailOrder,
	refund: { amountMinor: number; reason: string; refundedTotalMinor: number },
	origin?: string
) {
	const money = (m: number) => formatMoney(m, order.currency);
	const link = orderLink(order.ref, origin);
	const full = refund.refundedTotalMinor >= order.totalMinor;
	const text = [
		`Hello ${order.buyerName},`,
		'',
		`We have refunded ${money(refund.amountMinor)} on order ${order.ref}.`,
		`Reason: ${refund.reason}`,
		full
			? `That is the whole ${money(order.totalMinor)} you paid.`
			: `Refunded so far: ${money(refund.refundedTotalMinor)} of ${money(order.totalMinor)}.`,
		'',
		'Your bank usually shows the money within 5 to 10 working days.',
		'',
		`Your order: ${link}`
	].join('\n');
	const html =
		mailPage(`<h1 style="font-size:24px;margin:0 0 8px">A refund on order ${esc(order.ref)}</h1>
<p>Hello ${esc(order.buyerName)}, we have refunded <strong>${esc(money(refund.amountMinor))}</strong>.</p>
<p>Reason: ${esc(refund.reason)}</p>
<p>${full ? `That is the whole ${esc(money(order.totalMinor))} you paid.` : `Refunded so far: ${esc(money(refund.refundedTotalMinor))} of ${esc(money(order.totalMinor))}.`}</p>
<p>Your bank usually shows the money within 5 to 10 working days.</p>
${mailButton(link, 'See your order')}`);
	return { subject: `Refund of ${money(refund.amountMinor)} on order ${order.ref}`, text, html };
}

/** For the owner and helpers who asked: one short note per paid order, with a link to it. */
export function newOrderAlertMail(order: MailOrder, origin: string, readyBy: string | null) {
	const money = formatMoney(order.totalMinor, order.currency);
	const href = `${origin}/workshop/orders/${encodeURIComponent(order.ref)}`;
	const owed = order.balanceMinor ?? 0;
	const deposit =
		order.depositMinor !== undefined && owed > 0
			? `Deposit taken: ${formatMoney(order.depositMinor, order.currency)}; balance due: ${formatMoney(owed, order.currency)}.`
			: null;
	const headline = deposit ? 'New order, deposit taken,' : 'New paid order';
	const text = [
		`${headline} ${order.ref} from ${order.buyerName}: ${money}.`,
		...(deposit ? [deposit] : []),
		'',
		...order.lines.map(lineWords),
		'',
		`Promised to the buyer: ready to post by ${readyByWords(readyBy)}`,
		`Open it: ${href}`
	].join('\n');
	const html =
		mailPage(`<h1 style="font-size:22px;margin:0 0 8px">${esc(headline)} ${esc(order.ref)}</h1>
${deposit ? `<p>${esc(order.buyerName)} ordered for <strong>${esc(money)}</strong>. ${esc(deposit)}</p>` : `<p>${esc(order.buyerName)} paid <strong>${esc(money)}</strong>.</p>`}
<ul>${order.lines.map((l) => `<li>${esc(lineWords(l))}</li>`).join('')}</ul>
<p>Promised to the buyer: ready to post by <strong>${esc(readyByWords(readyBy))}</strong></p>
${mailButton(href, 'Open the order')}`);
	const subject = deposit
		? `New order ${order.ref} — ${money}, ${formatMoney(owed, order.currency)} still due`
		: `New order ${order.ref} — ${money}`;
	return { subject, text, html };
}
