import { majorText, percentText } from '../locale/money';

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
	return {
		name: f.name,
		place: f.place,
		startsOn: f.startsOn,
		endsOn: f.endsOn,
		boothFee: majorText(f.boothFeeMinor, f.currency),
		otherCosts: majorText(f.otherCostsMinor, f.currency),
		salesTax: percentText(f.salesTaxBp),
		pricesIncludeTax: f.pricesIncludeTax ? 'on' : '',
		cashFloat: majorText(f.cashFloatMinor, f.currency),
		cardFee: percentText(f.cardFeeBp),
		helperDiscount: percentText(f.helperDiscountBp),
		openHours: String(f.openMinutes / 60),
		notes: f.notes ?? ''
	};
}
