import { localHour, localIso } from '$lib/locale/dates';
import { majorText } from '$lib/locale/money';
import { stringify } from 'csv-stringify/sync';
import { db } from '../db';
import { fairs } from '../db/schema';
import { netPerHour, tallyEntries } from '$lib/booth/reconcile';
import { fairTally } from './tally';
import { fairCorrections } from './void';

/** Minor units as a plain decimal for the bookkeeper's spreadsheet (no currency sign). */
export const decimal = (minor: number, currency?: string) => majorText(minor, currency);

/** Takings by method, by piece and by hour on the shop's clock, plus the tally: the fair report. */
export async function fairReport(fairId: number) {
	const [t, corrections] = await Promise.all([fairTally(fairId), fairCorrections(fairId)]);
	// Voided sales stay on record but out of every total; a split counts in cash and in card.
	const sales = t.entries.filter((e) => e.kind === 'sale' && !e.voidedAt);
	const parts = tallyEntries(sales);
	const byMethod = (['cash', 'card', 'other'] as const).map((method) => {
		const of = parts.filter((s) => s.method === method);
		return { method, count: of.length, totalMinor: of.reduce((a, s) => a + s.totalMinor, 0) };
	});
	const pieceTotals = new Map<string, { label: string; quantity: number; totalMinor: number }>();
	for (const s of sales) {
		// Split a sale's discount over its lines in proportion, so piece totals add up to takings.
		const gross = s.lines.reduce((a, l) => a + l.unitPriceMinor * l.quantity, 0) || 1;
		let left = s.totalMinor;
		s.lines.forEach((l, i) => {
			const share =
				i === s.lines.length - 1
					? left
					: Math.round((s.totalMinor * l.unitPriceMinor * l.quantity) / gross);
			left -= share;
			const p = t.pieces.find((x) => x.pieceId === l.pieceId && x.woodId === l.woodId);
			const label = p ? `${p.title} · ${p.woodName}` : `piece ${l.pieceId}`;
			const cur = pieceTotals.get(label) ?? { label, quantity: 0, totalMinor: 0 };
			cur.quantity += l.quantity;
			cur.totalMinor += share;
			pieceTotals.set(label, cur);
		});
	}
	const hours = new Map<number, number>();
	for (const s of sales) {
		const hour = localHour(s.soldAt);
		hours.set(hour, (hours.get(hour) ?? 0) + s.totalMinor);
	}
	const byHour = [...hours.entries()]
		.sort((a, b) => a[0] - b[0])
		.map(([hour, totalMinor]) => ({ hour, totalMinor }));
	return {
		...t,
		byMethod,
		byPiece: [...pieceTotals.values()].sort((a, b) => b.totalMinor - a.totalMinor),
		byHour,
		corrections,
		netPerHourMinor: netPerHour(t.result.net, t.fair.openMinutes)
	};
}
export type FairReport = Awaited<ReturnType<typeof fairReport>>;

/** Every fair's net and net per hour open, oldest first, for the comparison chart. */
export async function fairsCompared() {
	const list = await db.select({ id: fairs.id }).from(fairs).orderBy(fairs.startsOn);
	const out = [];
	for (const { id } of list) {
		const t = await fairTally(id);
		if (t.entries.length === 0 && !t.fair.closedAt) continue;
		out.push({
			id,
			name: t.fair.name,
			startsOn: t.fair.startsOn,
			netMinor: t.result.net,
			netPerHourMinor: netPerHour(t.result.net, t.fair.openMinutes)
		});
	}
	return out;
}

/**
 * One row per booth entry (RFC 4180: CRLF line ends, quotes doubled), amounts in plain decimals,
 * the time on the shop's clock with its offset (ISO 8601), so it still says the exact moment,
 * starting with a UTF-8 byte-order mark so spreadsheets read accents and "×" right. The `total`
 * column holds takings only, so its sum is the fair's takings: a deposit's amount sits in
 * `deposit` (it belongs to its order, counted with the orders), a voided sale's in
 * `voided_amount`. Summary rows close the file (kind `summary`, figure in `summary_amount`).
 */
export function fairCsv(r: FairReport): string {
	const label = (pieceId: number, woodId: number) => {
		const p = r.pieces.find((x) => x.pieceId === pieceId && x.woodId === woodId);
		return p ? `${p.title} (${p.woodName})` : `piece ${pieceId}`;
	};
	const voidedBy = new Map(r.corrections.voids.map((v) => [v.id, v.by ?? '']));
	const blank = (n: number) => Array<string>(n).fill('');
	const rows = r.entries.map((e) => {
		const voided = Boolean(e.voidedAt);
		const deposit = e.kind === 'deposit';
		return [
			localIso(e.soldAt),
			e.id,
			deposit ? 'deposit' : voided ? 'voided sale' : 'sale',
			deposit
				? `deposit for order ${e.orderId ?? ''} (not takings)`.trim()
				: voided
					? 'voided'
					: '',
			e.method,
			e.lines.map((l) => `${l.quantity} × ${label(l.pieceId, l.woodId)}`).join('; '),
			decimal(deposit ? 0 : e.subtotalMinor, r.fair.currency),
			decimal(e.discountMinor, r.fair.currency),
			decimal(deposit || voided ? 0 : e.taxMinor, r.fair.currency),
			decimal(deposit || voided ? 0 : e.totalMinor, r.fair.currency),
			deposit ? decimal(e.totalMinor, r.fair.currency) : '',
			voided ? decimal(e.totalMinor, r.fair.currency) : '',
			e.cardPartMinor ? decimal(e.cardPartMinor, r.fair.currency) : '',
			e.late ? 'yes' : '',
			e.flagged ? 'yes' : '',
			voided ? (voidedBy.get(e.id) ?? '') : '',
			voided ? (e.voidReason ?? '') : '',
			''
		];
	});
	const res = r.result;
	const summary: [string, number][] = [
		['Takings', res.takings],
		['Sales tax', res.taxDue],
		['Card fees', res.card.fee],
		['Booth fee', res.boothFee],
		['Other costs', res.otherCosts],
		['Net', res.net]
	];
	for (const [what, minor] of summary)
		rows.push([...blank(2), 'summary', what, ...blank(13), decimal(minor, r.fair.currency)]);
	return (
		'\uFEFF' +
		stringify(rows, {
			header: true,
			columns: [
				'sold_at',
				'id',
				'kind',
				'note',
				'method',
				'pieces',
				'subtotal',
				'discount',
				'sales_tax',
				'total',
				'deposit',
				'voided_amount',
				'card_part',
				'late',
				'over_stock',
				'voided_by',
				'void_reason',
				'summary_amount'
			],
			record_delimiter: '\r\n'
		})
	);
}
