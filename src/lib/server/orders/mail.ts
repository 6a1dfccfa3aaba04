import { readyByWords } from '$lib/orders/ready-by-words';
import { carverObject, carverSubject, workshopWords } from '$lib/locale/shop-format';
import { formatMoney } from '$lib/locale/money';
import { styleWords } from '$lib/pattern/styles';
import { countryName } from '$lib/locale/countries';
import type { Tx } from '../db';
import { queueMail } from '../mail/outbox';
import { esc } from '../mail/html';
import { orderLink } from './links';
import type { OrderDetail } from './views';
import { careForAll, LETTERS_CARE } from '$lib/catalogue/care';
import { buyerReadyBy } from '$lib/queue/carving-queue';

/** Said to every buyer: finishes can come from nuts, and two of the woods are nut trees. */
const ALLERGY_LINE =
	'Some finishes are made from nut oils, and walnut and butternut are nut trees: if a nut allergy matters, reply to this e-mail and we will tell you exactly what was used.';

/** The confirmation as plain text and HTML; both carry the same facts. */
export function confirmationMail(order: OrderDetail, origin?: string) {
	const money = (m: number) => formatMoney(m, order.currency);
	const link = orderLink(order.ref, origin);
	const lineText = order.lines.map((l) => {
		const p = l.personalisation;
		const detail = p
			? `   Initials ${p.initials} · ${l.woodName} · ${styleWords(p.style)}, ${p.diameterMm} mm${p.chipCount ? ` · ${p.chipCount} chips` : ''}`
			: `   ${l.woodName} · ready now`;
		return `${l.quantity} × ${l.title} — ${money(l.lineTotalMinor)}\n${detail}`;
	});
	const ready = readyByWords(buyerReadyBy(order));
	const a = order.address;
	const addr = [
		a.line1,
		a.line2,
		`${a.city}${a.region ? `, ${a.region}` : ''} ${a.postcode}`,
		countryName(a.country)
	]
		.filter(Boolean)
		.join('\n');
	const totals: [string, number][] = [
		['Pieces', order.subtotalMinor],
		['Shipping', order.shippingMinor],
		...(order.taxMinor ? ([['Sales tax', order.taxMinor]] as [string, number][]) : []),
		['Total paid', order.totalMinor]
	];

	const care = careForAll(order.lines.map((l) => ({ ...l, personalised: !!l.personalisation })));
	const careText = [
		...care.notes.map((c) => `${c.title} (${c.pieces.join(', ')}): ${c.text}`),
		...(care.letters ? [LETTERS_CARE] : []),
		ALLERGY_LINE
	];

	const text = [
		`Thank you, ${order.buyerName}.`,
		'',
		`Your order ${order.ref} is paid. ${carverSubject()} will carve it in ${workshopWords()}.`,
		'',
		...lineText,
		'',
		...totals.map(([k, v]) => `${k}: ${money(v)}`),
		'',
		`Ready to post by ${ready}. We will write again with the tracking number.`,
		'',
		'Posting to:',
		order.buyerName,
		addr,
		...(order.giftNote ? ['', `Gift note: ${order.giftNote}`] : []),
		'',
		`See your order at any time: ${link}`,
		'',
		'Looking after your pieces',
		...careText
	].join('\n');

	const row = (k: string, v: string, strong = false) =>
		`<tr><td style="padding:4px 12px 4px 0">${strong ? `<strong>${esc(k)}</strong>` : esc(k)}</td><td style="padding:4px 0;text-align:right">${strong ? `<strong>${esc(v)}</strong>` : esc(v)}</td></tr>`;
	const html = `<!doctype html><html><body style="margin:0;background:#f6efe3;color:#2e2118;font-family:Nunito,Segoe UI,sans-serif;font-size:17px;line-height:1.5">
<div style="max-width:560px;margin:0 auto;padding:24px">
<h1 style="font-size:26px;margin:0 0 8px">Thank you, ${esc(order.buyerName)}.</h1>
<p>Your order <strong>${esc(order.ref)}</strong> is paid. ${esc(carverSubject())} will carve it in ${esc(workshopWords())}.</p>
<table style="width:100%;border-collapse:collapse;background:#fffaf2;border:1px solid #d9c8ae;border-radius:12px">
${order.lines
	.map((l) => {
		const p = l.personalisation;
		return `<tr><td style="padding:10px 12px;border-bottom:1px solid #d9c8ae"><strong>${l.quantity} × ${esc(l.title)}</strong><br>${
			p
				? `Initials <strong>${esc(p.initials)}</strong> · ${esc(l.woodName)} · ${esc(styleWords(p.style))}, ${p.diameterMm} mm`
				: `${esc(l.woodName)} · ready now`
		}</td><td style="padding:10px 12px;border-bottom:1px solid #d9c8ae;text-align:right;white-space:nowrap">${esc(money(l.lineTotalMinor))}</td></tr>`;
	})
	.join('\n')}
</table>
<table style="width:100%;margin-top:12px">${totals.map(([k, v], i) => row(k, money(v), i === totals.length - 1)).join('')}</table>
<p>Ready to post by <strong>${esc(ready)}</strong>. We will write again with the tracking number.</p>
<p style="white-space:pre-line">Posting to:\n${esc(order.buyerName)}\n${esc(addr)}</p>
${order.giftNote ? `<p>Gift note: <em>${esc(order.giftNote)}</em></p>` : ''}
<p><a href="${esc(link)}" style="display:inline-block;background:#9a4a22;color:#fffaf2;padding:10px 18px;border-radius:12px;text-decoration:none;font-weight:bold">See your order</a></p>
<h2 style="font-size:19px;margin:20px 0 4px">Looking after your pieces</h2>
${care.notes.map((c) => `<p style="font-size:15px;margin:4px 0"><strong>${esc(c.title)}</strong> (${esc(c.pieces.join(', '))}): ${esc(c.text)}</p>`).join('\n')}
${care.letters ? `<p style="font-size:15px;margin:4px 0">${esc(LETTERS_CARE)}</p>` : ''}
<p style="font-size:15px;margin:4px 0;color:#5c4a3c">${esc(ALLERGY_LINE)}</p>
</div></body></html>`;

	return { subject: `Order ${order.ref} is paid — thank you`, text, html };
}

/** Queues the confirmation inside the transaction that marks the order paid. */
export function queueConfirmation(tx: Tx, order: OrderDetail, origin?: string) {
	return queueMail(tx, { to: order.email, ...confirmationMail(order, origin) });
}

/**
 * The order was paid, but the finished piece had gone to another buyer in the meantime. Said
 * plainly: what happened, whether the money is on its way back, and that the workshop will write.
 */
export function pieceGoneMail(order: OrderDetail, origin?: string) {
	const money = formatMoney(order.totalMinor, order.currency);
	const pieces = order.lines
		.filter((l) => l.fromStock)
		.map((l) => `${l.quantity} × ${l.title} in ${l.woodName}`);
	const refund =
		order.refundedMinor >= order.totalMinor
			? `We are refunding the full ${money} to your card now. Banks usually show it within 5 to 10 working days.`
			: `We will refund the full ${money}; ${carverSubject()} will confirm by e-mail once it is done.`;
	const text = [
		`Dear ${order.buyerName},`,
		'',
		`Your payment for order ${order.ref} reached us after your hold on the piece had ended, and in the meantime it was sold to someone else:`,
		...pieces.map((p) => `   ${p}`),
		'',
		'We are sorry. Nothing will be posted for this order.',
		refund,
		'',
		`If you would like ${carverObject()} to carve another one for you, reply to this e-mail.`,
		'',
		`Your order: ${orderLink(order.ref, origin)}`
	].join('\n');
	const html = `<!doctype html><html><body style="font-family:Nunito,Segoe UI,sans-serif;font-size:17px;line-height:1.5;color:#2e2118">
<p>Dear ${esc(order.buyerName)},</p>
<p>Your payment for order <strong>${esc(order.ref)}</strong> reached us after your hold on the piece had ended, and in the meantime it was sold to someone else:</p>
<ul>${pieces.map((p) => `<li>${esc(p)}</li>`).join('')}</ul>
<p>We are sorry. Nothing will be posted for this order.</p>
<p><strong>${esc(refund)}</strong></p>
<p>If you would like ${esc(carverObject())} to carve another one for you, reply to this e-mail.</p>
</body></html>`;
	return {
		subject: `Order ${order.ref}: the piece was sold before your payment arrived`,
		text,
		html
	};
}

/** Queued with the move to `piece_gone`; the refund follows at once after the commit. */
export function queuePieceGone(tx: Tx, order: OrderDetail, origin?: string) {
	return queueMail(tx, { to: order.email, ...pieceGoneMail(order, origin) });
}

/**
 * The buyer paid on a payment page that a newer checkout of the same basket had already
 * replaced (two tabs, a double tap). The newer page is the one that counts; this payment goes
 * back in full. One plain letter says so.
 */
export function replacedPaidMail(order: OrderDetail, origin?: string) {
	const money = formatMoney(order.totalMinor, order.currency);
	const text = [
		`Dear ${order.buyerName},`,
		'',
		`You paid ${money} for order ${order.ref} on a payment page that had already been replaced: the same basket was sent to checkout again, in another tab or by a second tap.`,
		'',
		`So that you are not charged twice for one basket, we are refunding these ${money} to your card in full now. Banks usually show it within 5 to 10 working days.`,
		'',
		'If you also paid on the newer page, that order goes ahead as usual and you will get its own confirmation. If you did not, your basket still has the pieces: open it and pay once more.',
		'',
		`This order: ${orderLink(order.ref, origin)}`
	].join('\n');
	const html = `<!doctype html><html><body style="font-family:Nunito,Segoe UI,sans-serif;font-size:17px;line-height:1.5;color:#2e2118">
<p>Dear ${esc(order.buyerName)},</p>
<p>You paid ${esc(money)} for order <strong>${esc(order.ref)}</strong> on a payment page that had already been replaced: the same basket was sent to checkout again, in another tab or by a second tap.</p>
<p><strong>So that you are not charged twice for one basket, we are refunding these ${esc(money)} to your card in full now.</strong> Banks usually show it within 5 to 10 working days.</p>
<p>If you also paid on the newer page, that order goes ahead as usual and you will get its own confirmation. If you did not, your basket still has the pieces: open it and pay once more.</p>
</body></html>`;
	return { subject: `Order ${order.ref}: a second payment for one basket, refunded`, text, html };
}

export function queueReplacedPaid(tx: Tx, order: OrderDetail, origin?: string) {
	return queueMail(tx, { to: order.email, ...replacedPaidMail(order, origin) });
}
