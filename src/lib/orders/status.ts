/**
 * The order status flow, in one table. Pure and browser-safe: the schema's enum, the server's
 * `moveOrder`, and every page that shows or offers a status read it from here.
 *
 * pending → paid → carving → finishing → packed → shipped, side exits cancelled and refunded,
 * and `piece_gone`: the buyer paid, but the finished piece they paid for was sold meanwhile; the
 * owner resolves it (refund, or carve another and carry on).
 *
 * `deposit_held`: an order taken at a fair's booth with part paid and the balance still due. It
 * may go on the bench on the deposit (carving to order starts once a deposit is in hand); when the
 * balance is recorded while it waits, it moves to `paid` and joins the flow. It never ships until
 * the balance is paid (the ship step checks the balance).
 */
export const orderStatuses = [
	'pending',
	'paid',
	'carving',
	'finishing',
	'packed',
	'shipped',
	'cancelled',
	'refunded',
	'piece_gone',
	'deposit_held'
] as const;
export type OrderStatus = (typeof orderStatuses)[number];

/**
 * Every allowed move. `carvingOnly` edges are only open to orders with a line to carve; the
 * `readyMadeOnly` edge lets an order of finished shelf pieces go straight from paid to packed.
 * Once an order is on the bench (carving, finishing) it carries on whatever its lines are: the
 * owner may carve a new piece for a `piece_gone` order.
 */
type Edge = { to: OrderStatus; carvingOnly?: boolean; readyMadeOnly?: boolean };

export const transitions: Readonly<Record<OrderStatus, readonly Edge[]>> = {
	// The payment lands, the buyer gives up (or the hold lapses), or the piece sold meanwhile.
	pending: [{ to: 'paid' }, { to: 'cancelled' }, { to: 'piece_gone' }],
	// A cancelled (lapsed) checkout can still be paid late: the payment event decides.
	cancelled: [{ to: 'paid' }, { to: 'piece_gone' }],
	paid: [
		{ to: 'carving', carvingOnly: true },
		{ to: 'packed', readyMadeOnly: true },
		{ to: 'refunded' }
	],
	carving: [{ to: 'finishing' }, { to: 'refunded' }],
	finishing: [{ to: 'packed' }, { to: 'refunded' }],
	packed: [{ to: 'shipped' }, { to: 'refunded' }],
	shipped: [{ to: 'refunded' }],
	// The owner refunds, or makes another piece and puts the order back on the bench.
	piece_gone: [{ to: 'refunded' }, { to: 'carving' }],
	refunded: [],
	// Paid in full (the balance is recorded, see recordBalancePaid), carved on the deposit, or dropped.
	deposit_held: [
		{ to: 'paid' },
		{ to: 'carving', carvingOnly: true },
		{ to: 'cancelled' },
		{ to: 'refunded' }
	]
};

/** The statuses an order may move to next. */
export function nextStatuses(from: OrderStatus, opts: { needsCarving: boolean }): OrderStatus[] {
	return (transitions[from] ?? [])
		.filter((e) => (opts.needsCarving ? !e.readyMadeOnly : !e.carvingOnly))
		.map((e) => e.to);
}

export function canMove(from: OrderStatus, to: OrderStatus, opts: { needsCarving: boolean }) {
	return nextStatuses(from, opts).includes(to);
}

/**
 * One step back, for a move made too soon; only the owner takes it, with a reason. Kept apart
 * from `transitions` so a bench move or a bulk move can never walk an order backwards. A shipped
 * order does not step back: the buyer already has the tracking e-mail (refund it instead).
 */
export const backSteps: Readonly<Partial<Record<OrderStatus, readonly Edge[]>>> = {
	carving: [{ to: 'paid' }],
	finishing: [{ to: 'carving' }],
	packed: [
		{ to: 'finishing', carvingOnly: true },
		{ to: 'paid', readyMadeOnly: true }
	]
};

/** The status one step back from `from`, or null when there is none. */
export function stepBackTo(from: OrderStatus, opts: { needsCarving: boolean }): OrderStatus | null {
	const edge = (backSteps[from] ?? []).find((e) =>
		opts.needsCarving ? !e.readyMadeOnly : !e.carvingOnly
	);
	return edge?.to ?? null;
}

/** Paid and not yet shipped: cancelling means refunding what was paid. */
export const CANCEL_WITH_REFUND: readonly OrderStatus[] = [
	'paid',
	'carving',
	'finishing',
	'packed',
	'piece_gone'
];

/** Whether the owner may cancel an order in this status (unpaid checkouts, or paid and unshipped). */
export function canCancel(s: OrderStatus): boolean {
	return s === 'pending' || CANCEL_WITH_REFUND.includes(s);
}

/** Plain words for each status, for buyers and the workshop alike. */
export const statusLabels: Readonly<Record<OrderStatus, string>> = {
	pending: 'Waiting for payment',
	paid: 'Paid',
	carving: 'Carving',
	finishing: 'Finishing',
	packed: 'Packed',
	shipped: 'Shipped',
	cancelled: 'Cancelled',
	refunded: 'Refunded',
	piece_gone: 'Paid, piece sold meanwhile',
	deposit_held: 'Deposit taken, balance due'
};

export function statusLabel(s: OrderStatus): string {
	return statusLabels[s] ?? s;
}
