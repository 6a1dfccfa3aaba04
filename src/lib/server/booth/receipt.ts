/**
 * The receipt a buyer at the booth gets by e-mail when they give an address: what they bought,
 * the discount, sales tax, total and how it was paid. Sent through the mail outbox, so a sale is
 * never held up or undone by the mail server.
 */
import { eq, inArray } from 'drizzle-orm';
import { formatMoney } from '$lib/locale/money';
import { formatMoment } from '$lib/locale/dates';
import { db } from '../db';
import { boothSales, fairs, pieces, woods } from '../db/schema';
import { sendMail } from '../mail/send';
import { esc, mailPage } from '../mail/html';
import { getShopInfo } from '../settings/shop-settings';

export type ReceiptFacts = {
	shop: string;
	fair: string;
	currency: string;
	soldAt: Date;
	lines: { quantity: number; label: string; unitMinor: number }[];
	discountMinor: number;
	taxMinor: number;
	totalMinor: number;
	pricesIncludeTax: boolean;
	method: 'cash' | 'card' | 'other';
	cardPartMinor: number | null;
};

export function receiptMail(r: ReceiptFacts) {
	const money = (m: number) => formatMoney(m, r.currency);
	const paid =
		r.cardPartMinor && r.method === 'cash'
			? `${money(r.totalMinor - r.cardPartMinor)} in cash and ${money(r.cardPartMinor)} by card`
			: `${money(r.totalMinor)} ${r.method === 'cash' ? 'in cash' : r.method === 'card' ? 'by card' : 'another way'}`;
	const rows: [string, string][] = [
		...r.lines.map((l): [string, string] => [
			`${l.quantity} × ${l.label}`,
			money(l.unitMinor * l.quantity)
		]),
		...(r.discountMinor ? [['Discount', `−${money(r.discountMinor)}`] as [string, string]] : []),
		[`Sales tax${r.pricesIncludeTax ? ' (included)' : ''}`, money(r.taxMinor)],
		['Total', money(r.totalMinor)]
	];
	const text = [
		`Thank you for buying from ${r.shop} at ${r.fair}.`,
		`${formatMoment(r.soldAt)}`,
		'',
		...rows.map(([k, v]) => `${k}: ${v}`),
		'',
		`Paid ${paid}.`
	].join('\n');
	const html = mailPage(`<p>Thank you for buying from ${esc(r.shop)} at ${esc(r.fair)}.</p>
<p>${esc(formatMoment(r.soldAt))}</p>
<table>${rows.map(([k, v]) => `<tr><td style="padding:2px 12px 2px 0">${esc(k)}</td><td style="text-align:right">${esc(v)}</td></tr>`).join('')}</table>
<p>Paid ${esc(paid)}.</p>`);
	return { subject: `Your receipt from ${r.shop} at ${r.fair}`, text, html };
}

/** Sends the receipt for a stored sale; a failure stays in the outbox and never fails the sync. */
export async function sendReceipt(saleId: string) {
	try {
		const [row] = await db
			.select({ sale: boothSales, fair: fairs })
			.from(boothSales)
			.innerJoin(fairs, eq(fairs.id, boothSales.fairId))
			.where(eq(boothSales.id, saleId));
		if (!row?.sale.receiptEmail) return;
		const s = row.sale;
		const pieceRows = await db
			.select({ id: pieces.id, title: pieces.title })
			.from(pieces)
			.where(
				inArray(
					pieces.id,
					s.lines.map((l) => l.pieceId)
				)
			);
		const woodRows = await db
			.select({ id: woods.id, name: woods.name })
			.from(woods)
			.where(
				inArray(
					woods.id,
					s.lines.map((l) => l.woodId)
				)
			);
		const shop = await getShopInfo();
		await sendMail({
			to: s.receiptEmail!,
			...receiptMail({
				shop: shop.name,
				fair: row.fair.name,
				currency: row.fair.currency,
				soldAt: s.soldAt,
				lines: s.lines.map((l) => ({
					quantity: l.quantity,
					label: `${pieceRows.find((p) => p.id === l.pieceId)?.title ?? 'Piece'} in ${woodRows.find((w) => w.id === l.woodId)?.name ?? 'wood'}`,
					unitMinor: l.unitPriceMinor
				})),
				discountMinor: s.discountMinor,
				taxMinor: s.taxMinor,
				totalMinor: s.totalMinor,
				pricesIncludeTax: row.fair.pricesIncludeTax,
				method: s.method,
				cardPartMinor: s.cardPartMinor
			})
		});
	} catch (err) {
		console.error('booth receipt failed', saleId, err);
	}
}
