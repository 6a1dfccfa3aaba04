import { majorText } from './money';

/** A stored fair as the strings its edit form shows (amounts as 120.00, rates as 7.25). */
export function fairFormValues(f: {
	name: string;
	place: string;
	startsOn: string;
	endsOn: string;
	boothFeeMinor: number;
	otherCostsMinor: number;
	salesTaxBp: number;
	pricesIncludeTax: boolean;
	cashFloatMinor: number;
	cardFeeBp: number;
	helperDiscountBp: number;
	openMinutes: number;
	notes: string | null;
	currency?: string;
}): Record<string, string> {
	// Basis points as a percentage with two decimals (725 → 7.25).
	const percent = (bp: number) => `${Math.trunc(bp / 100)}.${String(bp % 100).padStart(2, '0')}`;
	return {
		name: f.name,
		place: f.place,
		startsOn: f.startsOn,
		endsOn: f.endsOn,
		boothFee: majorText(f.boothFeeMinor, f.currency),
		otherCosts: majorText(f.otherCostsMinor, f.currency),
		salesTax: percent(f.salesTaxBp),
		pricesIncludeTax: f.pricesIncludeTax ? 'on' : '',
		cashFloat: majorText(f.cashFloatMinor, f.currency),
		cardFee: percent(f.cardFeeBp),
		helperDiscount: percent(f.helperDiscountBp),
		openHours: String(f.openMinutes / 60),
		notes: f.notes ?? ''
	};
}
