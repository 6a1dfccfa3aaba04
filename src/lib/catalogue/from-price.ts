/**
 * The "from" price of a piece: the lowest unit price a buyer can actually pay for it today, as
 * the cart will price it (base price plus the wood's add-on; the standard layout carries no
 * carving surcharge). One function for the shop cards, the piece page and the sort by price,
 * so the figure a buyer is shown first is always one they can get.
 */
export type PricedWood = { priceAddOnMinor: number; inStock: number };

/** Woods a buyer can have: any offered wood when it is carved to order, else only what is ready. */
export function buyableWoods<W extends PricedWood>(personalisable: boolean, woods: W[]): W[] {
	return woods.filter((w) => personalisable || w.inStock > 0);
}

/**
 * Lowest base + add-on over the woods a buyer can have. When none can be had just now (a plain
 * piece sold out in every wood) it is the lowest over the woods offered, the price when it is back.
 */
export function fromPriceMinor(
	piece: { basePriceMinor: number; personalisable: boolean },
	woods: PricedWood[]
): number {
	const buyable = buyableWoods(piece.personalisable, woods);
	const over = buyable.length ? buyable : woods;
	if (!over.length) return piece.basePriceMinor;
	return piece.basePriceMinor + Math.min(...over.map((w) => w.priceAddOnMinor));
}
