/**
 * The booth's pure rules: the days a sale may be dated, late versus after the close, who may
 * void, a sale's fingerprint, percentage discounts, split payments in the tally, the caps and
 * the phone's batch sizes. Expected values are worked by hand.
 */
import { describe, expect, it } from 'vitest';
import {
	lateVerdict,
	percentOff,
	saleFingerprint,
	saleTimeProblem,
	voidRefusal
} from '$lib/booth/rules';
import { chunkByLimits } from '$lib/booth/chunks';
import { reconcile, tallyEntries } from '$lib/booth/reconcile';
import { boothSaleSchema, BOOTH_MAX_BYTES, BOOTH_MAX_SALES } from '$lib/booth/sync-message';

const fair = { name: 'Test fair', startsOn: '2026-12-05', endsOn: '2026-12-06' };
const now = new Date('2026-12-05T15:00:00Z');

describe('sale dates', () => {
	it('takes sales within the fair days and a 24-hour margin for zones and clocks', () => {
		expect(saleTimeProblem(new Date('2026-12-05T09:00:00Z'), fair, now)).toBeNull();
		// 23:00 the evening before, UTC, is already the first morning at UTC+10.
		expect(saleTimeProblem(new Date('2026-12-04T23:00:00Z'), fair, now)).toBeNull();
		expect(
			saleTimeProblem(new Date('2026-12-07T23:00:00Z'), fair, new Date('2026-12-07T23:30:00Z'))
		).toBeNull();
	});
	it('refuses 1999, a day long before the start, and a time far in the future', () => {
		expect(saleTimeProblem(new Date('1999-12-05T10:00:00Z'), fair, now)).toMatch(
			/dated 1999-12-05, before/
		);
		expect(saleTimeProblem(new Date('2026-12-03T10:00:00Z'), fair, now)).toMatch(
			/before Test fair starts/
		);
		expect(
			saleTimeProblem(new Date('2026-12-09T10:00:00Z'), fair, new Date('2026-12-09T10:00:00Z'))
		).toMatch(/after Test fair ended/);
		expect(saleTimeProblem(new Date('2026-12-07T10:00:00Z'), fair, now)).toMatch(/future/);
	});
	it('refuses a sale today at a fair that starts next March', () => {
		const march = { name: 'Spring fair', startsOn: '2027-03-06', endsOn: '2027-03-07' };
		expect(saleTimeProblem(now, march, now)).toMatch(/before Spring fair starts \(2027-03-06\)/);
	});
});

describe('late sales', () => {
	const close = new Date('2026-12-06T17:00:00.000Z');
	it('a sale made before the close is late, one made after is refused', () => {
		expect(lateVerdict(new Date('2026-12-06T16:59:00Z'), null)).toBe('on time');
		expect(lateVerdict(new Date('2026-12-06T16:59:00Z'), close)).toBe('late');
		expect(lateVerdict(new Date('2026-12-06T17:00:00.400Z'), close)).toBe('late');
		expect(lateVerdict(new Date('2026-12-06T17:00:01Z'), close)).toBe('after close');
	});
});

describe('who may void', () => {
	const sold = new Date('2026-12-05T11:00:00Z');
	it('the owner at any time; a helper on the sale’s day only', () => {
		expect(voidRefusal('owner', sold, new Date('2027-01-10T10:00:00Z'), now)).toBeNull();
		expect(voidRefusal('helper', sold, new Date('2026-12-05T14:00:00Z'), now)).toBeNull();
		expect(
			voidRefusal(
				'helper',
				sold,
				new Date('2026-12-06T09:00:00Z'),
				new Date('2026-12-06T09:00:00Z')
			)
		).toMatch(/only on the day/);
	});
});

describe('fingerprint', () => {
	const a = {
		id: 'abcdefgh-1',
		at: '2026-12-05T10:00:00.000Z',
		lines: [
			{ pieceSlug: 'a', woodSlug: 'w', quantity: 1 },
			{ pieceSlug: 'b', woodSlug: 'w', quantity: 2 }
		],
		discountMinor: 0,
		method: 'cash'
	};
	it('is the same whatever the order of lines and the spelling of the time', () => {
		expect(
			saleFingerprint({ ...a, lines: [...a.lines].reverse(), at: '2026-12-05T11:00:00+01:00' })
		).toBe(saleFingerprint(a));
	});
	it('differs when a count, the method or the discount differs', () => {
		expect(saleFingerprint({ ...a, method: 'card' })).not.toBe(saleFingerprint(a));
		expect(saleFingerprint({ ...a, discountMinor: 100 })).not.toBe(saleFingerprint(a));
		expect(saleFingerprint({ ...a, lines: [a.lines[0]] })).not.toBe(saleFingerprint(a));
	});
});

describe('percentage discount', () => {
	it('rounds half-up to the cent (hand arithmetic)', () => {
		expect(percentOff(4500, '10')).toBe(450);
		// 12.5 % of 19.99 = 2.49875 → 2.50.
		expect(percentOff(1999, '12.5')).toBe(250);
		// 15 % of 0.03 = 0.0045 → 0.00.
		expect(percentOff(3, '15')).toBe(0);
		expect(percentOff(1000, '100')).toBe(1000);
		expect(percentOff(1000, '101')).toBeNull();
		expect(percentOff(1000, 'ten')).toBeNull();
	});
});

describe('split payment and voids in the tally', () => {
	it('counts the cash part in the tin, the card part on the reader, the tax once', () => {
		// 40.00 + 7.25 % = 42.90; paid 20.00 by card, 22.90 in cash. The card part's tax share:
		// 2.90 × 20.00 / 42.90 = 1.3520 → 1.35; the cash part takes the other 1.55 (by hand).
		const entries = tallyEntries([
			{ kind: 'sale', method: 'cash', totalMinor: 4290, taxMinor: 290, cardPartMinor: 2000 },
			{ kind: 'sale', method: 'card', totalMinor: 1000, taxMinor: 68, voidedAt: new Date() }
		]);
		expect(entries).toEqual([
			{ kind: 'sale', method: 'cash', totalMinor: 2290, taxMinor: 155 },
			{ kind: 'sale', method: 'card', totalMinor: 2000, taxMinor: 135 }
		]);
		const r = reconcile({
			floatMinor: 10_000,
			cashPaidOutMinor: 0,
			cashCountedMinor: null,
			cardReportedMinor: null,
			cardFeeBp: 0,
			boothFeeMinor: 0,
			otherCostsMinor: 0,
			entries,
			stock: []
		});
		expect(r.cash.expected).toBe(12_290);
		expect(r.card.recorded).toBe(2000);
		expect(r.takings).toBe(4290);
		expect(r.taxDue).toBe(290);
	});
});

describe('caps', () => {
	const line = (i: number, quantity: number) => ({ pieceSlug: `p${i}`, woodSlug: 'w', quantity });
	const base = { id: 'abcdefgh-2', at: '2026-12-05T10:00:00Z', discountMinor: 0, method: 'cash' };
	it('refuses a sale of 50 lines × 100 (the sale that took a count to −90,339)', () => {
		const r = boothSaleSchema.safeParse({
			...base,
			lines: Array.from({ length: 50 }, (_, i) => line(i, 100))
		});
		expect(r.success).toBe(false);
		expect(r.error?.issues[0].message).toMatch(/at most 200 pieces/);
	});
	it('refuses the same piece on two lines, and takes 2 lines × 100', () => {
		expect(boothSaleSchema.safeParse({ ...base, lines: [line(1, 1), line(1, 2)] }).success).toBe(
			false
		);
		expect(
			boothSaleSchema.safeParse({ ...base, lines: [line(1, 100), line(2, 100)] }).success
		).toBe(true);
	});
});

describe('the phone’s batches', () => {
	it('fit the route: at most 1,000 sales and 2 MB each, nothing lost or reordered', () => {
		// 91 KB for 50 sales of 25 lines: the batch the old 64 KB cap refused.
		const big = Array.from({ length: 3000 }, (_, i) => ({
			id: `sale-${i}`,
			lines: Array.from({ length: 25 }, (_, j) => ({
				pieceSlug: `piece-${j}-xxxxxxxxxx`,
				woodSlug: 'black-walnut',
				quantity: 1
			}))
		}));
		const chunks = chunkByLimits(big, BOOTH_MAX_SALES, 1_500_000);
		for (const c of chunks) {
			expect(c.length).toBeLessThanOrEqual(BOOTH_MAX_SALES);
			expect(new TextEncoder().encode(JSON.stringify({ sales: c })).length).toBeLessThanOrEqual(
				BOOTH_MAX_BYTES
			);
		}
		expect(chunks.flat()).toEqual(big);
		expect(chunks.length).toBeGreaterThan(1);
		expect(chunkByLimits([1, 2, 3], 2, 1_000)).toEqual([[1, 2], [3]]);
	});
});
