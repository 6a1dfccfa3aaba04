/**
 * What an order has had paid and what is still owed. Browser-safe (the order page shows it).
 * An online order is paid in full at checkout; an order taken at a fair is paid in two parts:
 * the deposit at the booth, the balance before it ships.
 */
/** How the rest of a deposit order was paid (at a fair, by post, at the door). */
export const balanceMethods = ['cash', 'card', 'transfer', 'other'] as const;
export type BalanceMethod = (typeof balanceMethods)[number];

export type BalanceFacts = {
	totalMinor: number;
	depositMinor: number | null;
	balancePaidAt: Date | string | null;
	paidAt: Date | string | null;
};

export function orderBalance(o: BalanceFacts) {
	if (o.depositMinor === null) {
		const paid = o.paidAt ? o.totalMinor : 0;
		return { depositMinor: null, paidMinor: paid, balanceMinor: 0 };
	}
	const rest = Math.max(0, o.totalMinor - o.depositMinor);
	const balanceMinor = o.balancePaidAt ? 0 : rest;
	return { depositMinor: o.depositMinor, paidMinor: o.totalMinor - balanceMinor, balanceMinor };
}
