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
}): Record<string, string> {
	const two = (n: number) => (n / 100).toFixed(2);
	return {
		name: f.name,
		place: f.place,
		startsOn: f.startsOn,
		endsOn: f.endsOn,
		boothFee: two(f.boothFeeMinor),
		otherCosts: two(f.otherCostsMinor),
		salesTax: two(f.salesTaxBp),
		pricesIncludeTax: f.pricesIncludeTax ? 'on' : '',
		cashFloat: two(f.cashFloatMinor),
		cardFee: two(f.cardFeeBp),
		helperDiscount: two(f.helperDiscountBp),
		openHours: String(f.openMinutes / 60),
		notes: f.notes ?? ''
	};
}
