/**
 * The status table against the order flow written in the design notes (../shared/DESIGN.md,
 * "Order status flow"): pending → paid → carving → finishing → packed → shipped, side exits
 * cancelled and refunded, a state for "paid, but the piece is gone" that the owner resolves, and
 * ready-made lines skip carving. The flow itself is common practice for made-to-order work.
 */
import { describe, expect, it } from 'vitest';
import {
	canMove,
	nextStatuses,
	orderStatuses,
	statusLabel,
	transitions,
	type OrderStatus
} from '$lib/orders/status';
import { orderStatuses as schemaStatuses } from '$lib/server/db/schema';

const carved = { needsCarving: true };
const readyMade = { needsCarving: false };

/** Walks the main line from `pending` taking the first forward step each time. */
function mainLine(opts: { needsCarving: boolean }): OrderStatus[] {
	const path: OrderStatus[] = ['pending'];
	const forward = new Set<OrderStatus>(['paid', 'carving', 'finishing', 'packed', 'shipped']);
	for (;;) {
		const next = nextStatuses(path.at(-1)!, opts).find((s) => forward.has(s) && !path.includes(s));
		if (!next) return path;
		path.push(next);
	}
}

describe('order status table', () => {
	it('the schema uses the same list', () => {
		expect(schemaStatuses).toBe(orderStatuses);
	});

	it('a carved order walks pending → paid → carving → finishing → packed → shipped', () => {
		// DESIGN.md, order status flow.
		expect(mainLine(carved)).toEqual([
			'pending',
			'paid',
			'carving',
			'finishing',
			'packed',
			'shipped'
		]);
	});

	it('a ready-made order skips carving and finishing', () => {
		// DESIGN.md: "Ready-made lines skip carving."
		expect(mainLine(readyMade)).toEqual(['pending', 'paid', 'packed', 'shipped']);
		expect(canMove('paid', 'carving', readyMade)).toBe(false);
		expect(canMove('paid', 'packed', carved)).toBe(false);
	});

	it('side exits: an unpaid order may be cancelled, a paid one refunded, none skip ahead', () => {
		expect(canMove('pending', 'cancelled', carved)).toBe(true);
		for (const s of ['paid', 'carving', 'finishing', 'packed', 'shipped'] as const) {
			expect(canMove(s, 'refunded', carved), s).toBe(true);
			expect(canMove(s, 'cancelled', carved), s).toBe(false);
			expect(canMove(s, 'pending', carved), s).toBe(false);
		}
		expect(canMove('pending', 'shipped', carved)).toBe(false);
		expect(canMove('pending', 'refunded', carved)).toBe(false);
		expect(canMove('paid', 'shipped', readyMade)).toBe(false);
	});

	it('"piece gone" is reached only from a payment and left only by the owner’s choice', () => {
		const into = orderStatuses.filter((s) => canMove(s, 'piece_gone', carved));
		expect(into.sort()).toEqual(['cancelled', 'pending']);
		expect(nextStatuses('piece_gone', readyMade).sort()).toEqual(['carving', 'refunded']);
	});

	it('refunded is final and every status has a table row and a label', () => {
		expect(nextStatuses('refunded', carved)).toEqual([]);
		for (const s of orderStatuses) {
			expect(transitions[s], s).toBeDefined();
			expect(statusLabel(s).length, s).toBeGreaterThan(2);
		}
		// No move to the same status: a "move" must change something.
		for (const s of orderStatuses) expect(canMove(s, s, carved)).toBe(false);
	});
});
