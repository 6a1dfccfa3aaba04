/**
 * The booth's rules about time and identity, pure so the phone and the server agree: when a sale
 * may be dated, whether it arrived after the close, who may void it, and what makes two copies
 * of one sale "the same".
 */
import { isoDay } from '$lib/locale/dates';
import { mulDivHalfUp } from '$lib/tax/sales-tax';
import type { BoothSale } from './sync-message';

/**
 * How far outside the fair's days a sale may be dated and still be taken. Fair days are stored
 * as calendar days in UTC (see $lib/locale/dates); time zones run from UTC−12 to UTC+14, so 24 hours
 * covers every zone plus a phone clock some hours out. A clock a year out (1999) is refused.
 */
export const CLOCK_MARGIN_HOURS = 24;
const HOUR = 3_600_000;

export type FairDays = { name: string; startsOn: string; endsOn: string };

/** Why a sale made at `at` cannot belong to the fair, or null when it can. */
export function saleTimeProblem(at: Date, fair: FairDays, now = new Date()): string | null {
	const t = at.getTime();
	if (Number.isNaN(t)) return 'The sale has no readable time.';
	const opens = Date.parse(`${fair.startsOn}T00:00:00Z`) - CLOCK_MARGIN_HOURS * HOUR;
	const closes = Date.parse(`${fair.endsOn}T00:00:00Z`) + (24 + CLOCK_MARGIN_HOURS) * HOUR;
	const day = isoDay(at);
	if (t > now.getTime() + CLOCK_MARGIN_HOURS * HOUR)
		return `The sale is dated ${day}, in the future: check the phone's date and time.`;
	if (t < opens)
		return `The sale is dated ${day}, before ${fair.name} starts (${fair.startsOn}): check the phone's date and time.`;
	if (t > closes)
		return `The sale is dated ${day}, after ${fair.name} ended (${fair.endsOn}): check the phone's date and time.`;
	return null;
}

/**
 * A sale reaching a closed fair: made before the close (by its own time) it is taken and marked
 * late; made after, it is refused.
 */
export function lateVerdict(at: Date, closedAt: Date | null): 'on time' | 'late' | 'after close' {
	if (!closedAt) return 'on time';
	// The close is stored to the whole second (a DATETIME): a sale within that second counts.
	return at.getTime() < Math.floor(closedAt.getTime() / 1000) * 1000 + 1000
		? 'late'
		: 'after close';
}

/**
 * Who may void a sale: the owner at any time; a helper only on the sale's own day (the void's
 * time, made on the phone, falls on the same calendar day as the sale). Null when allowed.
 */
export function voidRefusal(
	role: string,
	soldAt: Date,
	voidAt: Date,
	now = new Date()
): string | null {
	if (role === 'owner') return null;
	if (voidAt.getTime() > now.getTime() + CLOCK_MARGIN_HOURS * HOUR)
		return 'The void is dated in the future: check the phone’s date and time.';
	if (isoDay(voidAt) !== isoDay(soldAt))
		return `A helper can void a sale only on the day it was made (${isoDay(soldAt)}); ask the owner.`;
	return null;
}

/** What makes a sale that sale: the message's own fields (the method as a word, as stored). */
export type SaleContent = Omit<BoothSale, 'method' | 'receiptEmail'> & {
	method: string;
	receiptEmail?: string | null;
};

/**
 * One string for what a sale says, whatever order its lines or keys came in: the server keeps a
 * hash of it, so the same id sent again with other content is told apart from a plain resend.
 */
export function saleFingerprint(s: SaleContent): string {
	const lines = [...s.lines]
		.map((l) => `${l.pieceSlug}/${l.woodSlug}×${l.quantity}`)
		.sort()
		.join(',');
	return [
		s.id,
		new Date(s.at).toISOString(),
		lines,
		s.discountMinor,
		s.method,
		s.tenderedMinor ?? '',
		s.cardPartMinor ?? '',
		s.receiptEmail || ''
	].join('|');
}

/** A percentage discount (up to two decimals, as typed) → an amount off, rounded half-up. */
export function percentOff(subtotalMinor: number, percentText: string): number | null {
	const m = /^\s*(\d{1,3})(?:[.,](\d{1,2}))?\s*%?\s*$/.exec(percentText);
	if (!m) return null;
	const bp = Number(m[1]) * 100 + Number((m[2] ?? '').padEnd(2, '0'));
	if (bp > 10_000) return null;
	return mulDivHalfUp(subtotalMinor, bp, 10_000);
}
