/**
 * The booth's arithmetic, pure and in integer minor units: pricing one sale (discount, sales tax
 * added to or held inside the price) and the end-of-fair tally (stock, cash, card, tax, net).
 *
 * Sales tax is worked out once per sale (invoice basis), on the sale's amount after discount, by
 * `saleTax` in `$lib/tax/sales-tax` (the rule and its half-up rounding live there). The fair's tax
 * due is the sum of those per-sale amounts.
 */
import { mulDivHalfUp, saleTax } from '../tax/sales-tax';

export type SaleMethod = 'cash' | 'card' | 'other';

/** Largest discount allowed on a subtotal under a limit in basis points (rounded down). */
export function maxDiscount(subtotalMinor: number, limitBp: number): number {
	return Math.floor((subtotalMinor * limitBp) / 10_000);
}

export type SaleLine = { unitMinor: number; quantity: number };

export type PricedSale = {
	subtotalMinor: number;
	discountMinor: number;
	/** Amount the tax is charged on (net of tax). */
	taxableMinor: number;
	taxMinor: number;
	/** What the buyer pays. */
	totalMinor: number;
};

export function priceSale(
	lines: SaleLine[],
	discountMinor: number,
	rateBp: number,
	pricesIncludeTax: boolean
): PricedSale {
	const subtotal = lines.reduce((a, l) => a + l.unitMinor * l.quantity, 0);
	if (!Number.isInteger(discountMinor) || discountMinor < 0 || discountMinor > subtotal) {
		throw new Error('Discount must be between nothing and the whole sale');
	}
	const after = subtotal - discountMinor;
	return { subtotalMinor: subtotal, discountMinor, ...saleTax(after, rateBp, pricesIncludeTax) };
}

/** Change due for cash tendered; null when the buyer handed over too little. */
export function changeDue(tenderedMinor: number, totalMinor: number): number | null {
	return tenderedMinor >= totalMinor ? tenderedMinor - totalMinor : null;
}

export type TallyEntry = {
	kind: 'sale' | 'deposit';
	method: SaleMethod;
	totalMinor: number;
	taxMinor: number;
};

/** A booth entry as stored: the parts the tally needs, with its split and its void. */
export type StoredEntry = TallyEntry & {
	cardPartMinor?: number | null;
	voidedAt?: Date | string | null;
};

/**
 * The entries the tally counts: a voided sale is left out (takings, tax and method totals
 * alike); a split payment counts as a cash part and a card part, the sale's tax shared between
 * them in proportion (the card part's share rounded half-up, the cash part taking the rest so
 * the two add up to the sale's tax).
 */
export function tallyEntries(rows: StoredEntry[]): TallyEntry[] {
	return rows
		.filter((e) => !e.voidedAt)
		.flatMap((e): TallyEntry[] => {
			const card = e.cardPartMinor ?? 0;
			const base = {
				kind: e.kind,
				method: e.method,
				totalMinor: e.totalMinor,
				taxMinor: e.taxMinor
			};
			if (card <= 0 || card >= e.totalMinor || e.method !== 'cash') return [base];
			const cardTax = mulDivHalfUp(e.taxMinor, card, e.totalMinor);
			return [
				{ ...base, totalMinor: e.totalMinor - card, taxMinor: e.taxMinor - cardTax },
				{ ...base, method: 'card', totalMinor: card, taxMinor: cardTax }
			];
		});
}

export type TallyStockLine = {
	key: string;
	label: string;
	loadedOut: number;
	sold: number;
	counted: number | null;
};

export type TallyInput = {
	floatMinor: number;
	cashPaidOutMinor: number;
	cashCountedMinor: number | null;
	cardReportedMinor: number | null;
	cardFeeBp: number;
	boothFeeMinor: number;
	otherCostsMinor: number;
	entries: TallyEntry[];
	stock: TallyStockLine[];
};

export type StockVerdict = 'ok' | 'missing' | 'extra' | 'not counted';
export type CardVerdict = 'matches' | 'fee taken' | 'over' | 'short' | 'not entered';

export function reconcile(t: TallyInput) {
	const sum = (f: (e: TallyEntry) => boolean, v: (e: TallyEntry) => number) =>
		t.entries.filter(f).reduce((a, e) => a + v(e), 0);
	const sale = (m: SaleMethod) => (e: TallyEntry) => e.kind === 'sale' && e.method === m;
	const deposit = (m: SaleMethod) => (e: TallyEntry) => e.kind === 'deposit' && e.method === m;
	const total = (e: TallyEntry) => e.totalMinor;

	const stock = t.stock.map((l) => {
		const expectedLeft = l.loadedOut - l.sold;
		const difference = l.counted === null ? null : l.counted - expectedLeft;
		const verdict: StockVerdict =
			difference === null
				? 'not counted'
				: difference === 0
					? 'ok'
					: difference < 0
						? 'missing'
						: 'extra';
		return { ...l, expectedLeft, difference, verdict };
	});

	const cashTakings = sum(sale('cash'), total);
	const cashDeposits = sum(deposit('cash'), total);
	const cashExpected = t.floatMinor + cashTakings + cashDeposits - t.cashPaidOutMinor;
	const cashDifference = t.cashCountedMinor === null ? null : t.cashCountedMinor - cashExpected;

	const cardRecorded = sum(sale('card'), total) + sum(deposit('card'), total);
	const cardDifference = t.cardReportedMinor === null ? null : t.cardReportedMinor - cardRecorded;
	const feeOnRecorded = mulDivHalfUp(cardRecorded, t.cardFeeBp, 10_000);
	let cardVerdict: CardVerdict = 'not entered';
	if (cardDifference !== null) {
		// A reader that pays out net of its fee reports recorded − fee: that gap is explained.
		if (cardDifference === 0) cardVerdict = 'matches';
		else if (cardDifference < 0 && Math.abs(cardDifference + feeOnRecorded) <= 1)
			cardVerdict = 'fee taken';
		else cardVerdict = cardDifference > 0 ? 'over' : 'short';
	}
	const cardFee =
		cardVerdict === 'fee taken'
			? -(cardDifference ?? 0)
			: mulDivHalfUp(t.cardReportedMinor ?? cardRecorded, t.cardFeeBp, 10_000);
	const cardUnexplained = cardVerdict === 'over' || cardVerdict === 'short' ? cardDifference! : 0;

	const takings = sum((e) => e.kind === 'sale', total);
	const taxDue = sum(
		(e) => e.kind === 'sale',
		(e) => e.taxMinor
	);
	const otherTakings = sum(sale('other'), total);
	// Deposits belong to their orders, not to the fair's net; cash and card gaps are real money.
	const net =
		takings -
		taxDue -
		cardFee -
		t.boothFeeMinor -
		t.otherCostsMinor +
		(cashDifference ?? 0) +
		cardUnexplained;

	return {
		stock,
		stockProblems: stock.filter((l) => l.verdict === 'missing' || l.verdict === 'extra').length,
		cash: {
			float: t.floatMinor,
			takings: cashTakings,
			deposits: cashDeposits,
			paidOut: t.cashPaidOutMinor,
			expected: cashExpected,
			counted: t.cashCountedMinor,
			difference: cashDifference
		},
		card: {
			recorded: cardRecorded,
			reported: t.cardReportedMinor,
			difference: cardDifference,
			fee: cardFee,
			verdict: cardVerdict
		},
		otherTakings,
		takings,
		taxDue,
		taxable: takings - taxDue,
		boothFee: t.boothFeeMinor,
		otherCosts: t.otherCostsMinor,
		net
	};
}

export type Reconciliation = ReturnType<typeof reconcile>;

/** Net per hour open, rounded half-up to the minor unit (negative nets stay negative). */
export function netPerHour(netMinor: number, openMinutes: number): number {
	if (openMinutes <= 0) return 0;
	const v = mulDivHalfUp(Math.abs(netMinor), 60, openMinutes);
	return netMinor < 0 ? -v : v;
}
