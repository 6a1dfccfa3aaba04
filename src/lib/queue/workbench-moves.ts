import type { OrderStatus } from '$lib/orders/status';

/**
 * The moves a person makes with one click at the bench. The rest of the status table is walked
 * by its own paths: payment outcomes by the payment server's events, cancelling by releasing the
 * hold, shipping by the shipping form, refunds by the refund form.
 */
export const BENCH_MOVES = ['carving', 'finishing', 'packed'] as const satisfies OrderStatus[];

export function isBenchMove(to: OrderStatus): to is (typeof BENCH_MOVES)[number] {
	return (BENCH_MOVES as readonly OrderStatus[]).includes(to);
}
