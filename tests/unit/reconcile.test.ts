/**
 * The booth arithmetic against worked examples done by hand below (common practice for a
 * cash-box tally: expected = float + cash in − cash out; expected stock = loaded − sold).
 */
import { describe, expect, it } from 'vitest';
import {
	changeDue,
	maxDiscount,
	netPerHour,
	priceSale,
	reconcile,
	type TallyInput
} from '$lib/booth/reconcile';

describe('sales tax on one sale', () => {
	it('adds tax to tax-exclusive prices: 20.00 at 7.25 % is 1.45, so 21.45', () => {
		// Worked by hand: 2000 × 0.0725 = 145 (common practice: tax on the price after discount).
		expect(priceSale([{ unitMinor: 2000, quantity: 1 }], 0, 725, false)).toEqual({
			subtotalMinor: 2000,
			discountMinor: 0,
			taxableMinor: 2000,
			taxMinor: 145,
			totalMinor: 2145
		});
	});

	it('takes tax out of tax-inclusive prices: 21.45 at 7.25 % holds 1.45', () => {
		// Worked by hand: 21.45 / 1.0725 = 20.00, so 1.45 of it is tax (common practice).
		expect(priceSale([{ unitMinor: 2145, quantity: 1 }], 0, 725, true)).toEqual({
			subtotalMinor: 2145,
			discountMinor: 0,
			taxableMinor: 2000,
			taxMinor: 145,
			totalMinor: 2145
		});
	});

	it('taxes the amount after the discount', () => {
		// Two at 18.00 = 36.00, less 6.00 = 30.00; 30.00 × 6 % = 1.80 (worked by hand).
		const p = priceSale([{ unitMinor: 1800, quantity: 2 }], 600, 600, false);
		expect(p.taxMinor).toBe(180);
		expect(p.totalMinor).toBe(3180);
	});

	it('rounds the sale’s tax once, half-up (SSUTA §324; more in tax.test.ts)', () => {
		// 1.00 + 1.00 (two pieces) at 7.25 %: once on 2.00 = 0.145 → 0.15, not 0.07 + 0.07.
		expect(
			priceSale(
				[
					{ unitMinor: 100, quantity: 1 },
					{ unitMinor: 100, quantity: 1 }
				],
				0,
				725,
				false
			).taxMinor
		).toBe(15);
	});

	it('refuses a discount larger than the sale or negative', () => {
		expect(() => priceSale([{ unitMinor: 500, quantity: 1 }], 501, 0, false)).toThrow();
		expect(() => priceSale([{ unitMinor: 500, quantity: 1 }], -1, 0, false)).toThrow();
	});

	it('limits a helper discount to a share of the subtotal, rounded down', () => {
		// 10 % of 45.55 = 4.555 → 4.55 (round down, so the limit is never exceeded).
		expect(maxDiscount(4555, 1000)).toBe(455);
	});

	it('works out the change due on cash tendered', () => {
		// 50.00 handed over for 21.45: 28.55 back (common practice).
		expect(changeDue(5000, 2145)).toBe(2855);
		expect(changeDue(2000, 2145)).toBeNull();
	});
});

describe('the end-of-fair tally', () => {
	// A worked fair, done by hand: float 100.00, booth fee 60.00, other costs 15.00, card reader
	// fee 2.6 %, tax 7.25 % added. Sales: cash 21.45 (tax 1.45), cash 42.90 (tax 2.90), card
	// 64.35 (tax 4.35), other 10.73 (tax 0.73). A cash deposit of 20.00 for a personalised order.
	// 5.00 paid out of the box for lunch.
	const base: TallyInput = {
		floatMinor: 10000,
		cashPaidOutMinor: 500,
		cashCountedMinor: 17435,
		cardReportedMinor: 6268,
		cardFeeBp: 260,
		boothFeeMinor: 6000,
		otherCostsMinor: 1500,
		entries: [
			{ kind: 'sale', method: 'cash', totalMinor: 2145, taxMinor: 145 },
			{ kind: 'sale', method: 'cash', totalMinor: 4290, taxMinor: 290 },
			{ kind: 'sale', method: 'card', totalMinor: 6435, taxMinor: 435 },
			{ kind: 'sale', method: 'other', totalMinor: 1073, taxMinor: 73 },
			{ kind: 'deposit', method: 'cash', totalMinor: 2000, taxMinor: 0 }
		],
		stock: [
			{ key: 'a', label: 'Ornament · basswood', loadedOut: 10, sold: 4, counted: 5 },
			{ key: 'b', label: 'Box · walnut', loadedOut: 2, sold: 1, counted: 1 },
			{ key: 'c', label: 'Scoop · cherry', loadedOut: 3, sold: 0, counted: null }
		]
	};
	const r = reconcile(base);

	it('flags stock short by one: 10 loaded − 4 sold = 6 expected, 5 counted', () => {
		// Common practice: expected left = loaded − sold.
		expect(r.stock[0]).toMatchObject({ expectedLeft: 6, difference: -1, verdict: 'missing' });
		expect(r.stock[1]).toMatchObject({ expectedLeft: 1, difference: 0, verdict: 'ok' });
		expect(r.stock[2]).toMatchObject({ expectedLeft: 3, difference: null, verdict: 'not counted' });
		expect(r.stockProblems).toBe(1);
	});

	it('finds the cash 5.00 short: 100.00 + 64.35 + 20.00 − 5.00 = 179.35 expected, 174.35 counted', () => {
		// Common practice: expected cash = float + cash takings + cash deposits − cash paid out.
		expect(r.cash).toEqual({
			float: 10000,
			takings: 6435,
			deposits: 2000,
			paidOut: 500,
			expected: 17935,
			counted: 17435,
			difference: -500
		});
	});

	it('accepts a card total short by exactly the reader fee: 64.35 − 1.67 = 62.68', () => {
		// 64.35 × 2.6 % = 1.6731 → 1.67 (worked by hand; readers commonly pay out net of fee).
		expect(r.card).toEqual({
			recorded: 6435,
			reported: 6268,
			difference: -167,
			fee: 167,
			verdict: 'fee taken'
		});
		const gross = reconcile({ ...base, cardReportedMinor: 6435 });
		expect(gross.card.verdict).toBe('matches');
		expect(gross.card.fee).toBe(167);
		const short = reconcile({ ...base, cardReportedMinor: 6000 });
		expect(short.card.verdict).toBe('short');
	});

	it('sums tax due per sale and works out the net', () => {
		// Tax 1.45 + 2.90 + 4.35 + 0.73 = 9.43 on takings of 139.43 (deposits excluded).
		expect(r.takings).toBe(13943);
		expect(r.taxDue).toBe(943);
		expect(r.taxable).toBe(13000);
		// Net = 139.43 − 9.43 tax − 1.67 fee − 60.00 booth − 15.00 costs − 5.00 cash short = 48.33.
		expect(r.net).toBe(4833);
	});

	it('gives net per hour open', () => {
		// 48.33 over 7 h 30 min = 6.444 → 6.44 per hour (worked by hand).
		expect(netPerHour(4833, 450)).toBe(644);
		expect(netPerHour(-4833, 450)).toBe(-644);
	});
});
