/**
 * Packing and gift slips as one PDF, a page (or more) per order. Page sizes in PDF points
 * (1/72 in): A4 is 210 × 297 mm (ISO 216) = 595.28 × 841.89 pt, US Letter 8.5 × 11 in =
 * 612 × 792 pt, the shipping label 4 × 6 in = 288 × 432 pt. The gift slip prints no prices.
 * Relative imports only: the bench runs this under tsx.
 */
import { PDFDocument, rgb, type PDFImage, type PDFPage } from 'pdf-lib';
import QRCode from 'qrcode';
import { styleWords } from '../../pattern/styles';
import { formatMoney } from '$lib/locale/money';
import { PdfFonts, type Weight } from './fonts';
import type { SlipOrder, SlipShop } from './slip-data';

export const SLIP_PAPERS = {
	a4: [595.28, 841.89],
	letter: [612, 792],
	label: [288, 432]
} as const;
export type SlipPaper = keyof typeof SLIP_PAPERS;
export type SlipKind = 'packing' | 'gift';

const INK = rgb(0.12, 0.09, 0.07);
const SOFT = rgb(0.42, 0.37, 0.33);

/** The workshop order page the packing slip's QR opens (bench scanner or phone). */
export const orderPageUrl = (origin: string, ref: string) =>
	`${origin.replace(/\/$/, '')}/workshop/orders/${encodeURIComponent(ref)}`;

/**
 * The gift slip's QR: the recipient is not the buyer and has no account, so it opens the shop's
 * public care page (how to look after the piece), never the workshop's signed-in order page.
 */
export const giftCareUrl = (origin: string) => `${origin.replace(/\/$/, '')}/care`;

/** Writes lines top-down and starts a new page when one is full. */
class Cursor {
	page: PDFPage;
	y: number;
	constructor(
		private doc: PDFDocument,
		private fonts: PdfFonts,
		private paper: readonly [number, number],
		readonly margin: number
	) {
		this.page = doc.addPage([paper[0], paper[1]]);
		this.y = paper[1] - margin;
	}
	get width() {
		return this.paper[0] - 2 * this.margin;
	}
	need(h: number) {
		if (this.y - h < this.margin) {
			this.page = this.doc.addPage([this.paper[0], this.paper[1]]);
			this.y = this.paper[1] - this.margin;
		}
	}
	text(
		s: string,
		weight: Weight,
		size: number,
		opts: { x?: number; color?: typeof INK; width?: number } = {}
	) {
		const width = opts.width ?? this.width - (opts.x ?? 0);
		for (const line of this.fonts.wrap(s, size, width, weight)) {
			this.need(size * 1.3);
			this.y -= size * 1.3;
			this.fonts.draw(this.page, line, {
				x: this.margin + (opts.x ?? 0),
				y: this.y,
				size,
				weight,
				color: opts.color ?? INK
			});
		}
	}
	gap(h: number) {
		this.y -= h;
	}
}

async function qrImage(doc: PDFDocument, url: string): Promise<PDFImage> {
	// Error correction M (15 %) survives a scuffed slip; a 4-module quiet zone as the standard asks.
	const png = await QRCode.toBuffer(url, {
		type: 'png',
		errorCorrectionLevel: 'M',
		margin: 4,
		scale: 6
	});
	return doc.embedPng(png);
}

async function drawOrder(
	doc: PDFDocument,
	fonts: PdfFonts,
	shop: SlipShop,
	o: SlipOrder,
	paper: SlipPaper,
	kind: SlipKind,
	origin: string
) {
	const small = paper === 'label';
	const size = small ? 7.5 : 10;
	const head = small ? 11 : 16;
	await fonts.cover(
		...shop.address,
		shop.name,
		shop.email,
		...o.address,
		o.giftNote,
		...o.lines.flatMap((l) => [l.title, l.woodName, l.initials])
	);
	const c = new Cursor(doc, fonts, SLIP_PAPERS[paper], small ? 14 : 40);
	const qrSize = small ? 62 : 86;
	const qr = await qrImage(
		doc,
		kind === 'gift' ? giftCareUrl(origin) : orderPageUrl(origin, o.ref)
	);
	const top = c.y;
	c.page.drawImage(qr, {
		x: SLIP_PAPERS[paper][0] - c.margin - qrSize,
		y: top - qrSize,
		width: qrSize,
		height: qrSize
	});

	const textWidth = c.width - qrSize - 8;
	const col = (lines: string[], label: string) => {
		c.text(label, 'bold', size, { color: SOFT });
		for (const l of lines) c.text(l, 'regular', size, { width: textWidth });
	};
	c.text(kind === 'gift' ? 'Gift slip' : 'Packing slip', 'bold', head);
	c.text(`Order ${o.ref} · placed ${o.placedOn}`, 'bold', size);
	if (kind === 'packing' && o.readyBy)
		c.text(`Promised: ready to post by ${o.readyBy}`, 'regular', size, { width: textWidth });
	c.gap(size * 0.6);
	col(shop.address.length ? shop.address : [shop.name], 'From');
	c.gap(size * 0.6);
	col(o.address, 'Ship to');
	c.y = Math.min(c.y, top - qrSize - 6);
	c.gap(size);

	c.text(kind === 'gift' ? 'In this parcel' : 'Lines', 'bold', size + 1);
	for (const l of o.lines) {
		c.gap(size * 0.3);
		const price = kind === 'packing' ? `  —  ${formatMoney(l.lineTotalMinor, o.currency)}` : '';
		c.text(`${l.quantity} × ${l.title}, ${l.woodName}${price}`, 'bold', size);
		if (l.initials)
			c.text(
				`Personalised: initials "${l.initials}"${l.style ? ` (${styleWords(l.style)})` : ''}`,
				'regular',
				size,
				{ x: 10 }
			);
		else c.text('Ready-made', 'regular', size, { x: 10, color: SOFT });
	}
	if (kind === 'packing') {
		c.gap(size * 0.6);
		for (const [label, v] of [
			['Subtotal', o.subtotalMinor],
			['Shipping', o.shippingMinor],
			['Sales tax', o.taxMinor],
			['Total', o.totalMinor]
		] as const) {
			c.text(
				`${label}: ${formatMoney(v, o.currency)}`,
				label === 'Total' ? 'bold' : 'regular',
				size
			);
		}
	}
	if (o.giftNote) {
		c.gap(size);
		c.text('Gift note', 'bold', size + 1);
		c.text(o.giftNote, 'regular', size + (kind === 'gift' ? 2 : 0));
	}
	c.gap(size);
	c.text(
		kind === 'gift'
			? `Hand-carved for you by ${shop.name}. Scan the code for how to look after it. Questions: ${shop.email}`
			: `Questions or returns: ${shop.email}`,
		'regular',
		size - 1,
		{ color: SOFT }
	);
}

/** One PDF holding a slip for each order, in the order given. */
export async function slipsPdf(
	shop: SlipShop,
	list: SlipOrder[],
	opts: { paper: SlipPaper; kind: SlipKind; origin: string }
): Promise<Uint8Array> {
	const doc = await PDFDocument.create();
	doc.setTitle(
		`${opts.kind === 'gift' ? 'Gift' : 'Packing'} slips ${list.map((o) => o.ref).join(', ')}`
	);
	doc.setCreator(shop.name);
	const fonts = await PdfFonts.for(doc);
	for (const o of list) await drawOrder(doc, fonts, shop, o, opts.paper, opts.kind, opts.origin);
	return doc.save();
}
