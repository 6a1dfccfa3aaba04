import { localHour, localIso } from '$lib/dates';
import { majorText } from '$lib/money';
import { stringify } from 'csv-stringify/sync';
import { db } from '../db';
import { fairs } from '../db/schema';
import { netPerHour } from '$lib/reconcile';
import { fairTally } from './tally';

/** Minor units as a plain decimal for the bookkeeper's spreadsheet (no currency sign). */
export const decimal = (minor: number, currency?: string) => majorText(minor, currency);

/** Takings by method, by piece and by hour on the shop's clock, plus the tally: the fair report. */
export async function fairReport(fairId: number) {
	const t = await fairTally(fairId);
	const sales = t.entries.filter((e) => e.kind === 'sale');
	const byMethod = (['cash', 'card', 'other'] as const).map((method) => {
		const of = sales.filter((s) => s.method === method);
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
 * One row per booth entry (RFC 4180: CRLF line ends, quotes doubled); amounts in plain decimals;
 * the time on the shop's clock with its offset (ISO 8601), so it still says the exact moment.
 */
export function fairCsv(r: FairReport): string {
	const label = (pieceId: number, woodId: number) => {
		const p = r.pieces.find((x) => x.pieceId === pieceId && x.woodId === woodId);
		return p ? `${p.title} (${p.woodName})` : `piece ${pieceId}`;
	};
	const rows = r.entries.map((e) => [
		localIso(e.soldAt),
		e.id,
		e.kind,
		e.method,
		e.lines.map((l) => `${l.quantity} × ${label(l.pieceId, l.woodId)}`).join('; '),
		decimal(e.kind === 'sale' ? e.subtotalMinor : 0, r.fair.currency),
		decimal(e.discountMinor, r.fair.currency),
		decimal(e.taxMinor, r.fair.currency),
		decimal(e.totalMinor, r.fair.currency),
		e.flagged ? 'yes' : ''
	]);
	return stringify(rows, {
		header: true,
		columns: [
			'sold_at',
			'id',
			'kind',
			'method',
			'pieces',
			'subtotal',
			'discount',
			'sales_tax',
			'total',
			'over_stock'
		],
		record_delimiter: '\r\n'
	});
}
