/**
 * What the booth's sync does when the server refuses the person rather than the entry. HTTP
 * semantics (RFC 9110 §15.5.2 and §15.5.4): 401 means the request lacks valid credentials (sign
 * in again), 403 means the server understood who asks and will not let them (not named a helper
 * yet). Neither says anything about the entry, so nothing is refused for good: it waits. The
 * outbox is kept in memory here (the browser keeps it in IndexedDB); fetch is a fake.
 */
import { beforeEach, describe, expect, it, vi } from 'vitest';
import type { Queued } from '$lib/booth/outbox';

const box = vi.hoisted(() => ({ waiting: [] as Queued[], refused: [] as Queued[] }));
vi.mock('$lib/booth/outbox', () => ({
	waiting: (fairId: number) => Promise.resolve(box.waiting.filter((q) => q.fairId === fairId)),
	settle: (ids: string[]) => {
		box.waiting = box.waiting.filter((q) => !ids.includes(q.id));
		return Promise.resolve();
	},
	refuse: (entries: { entry: Queued; error: string }[]) => {
		for (const { entry, error } of entries) {
			box.waiting = box.waiting.filter((q) => q.id !== entry.id);
			box.refused.push({ ...entry, error });
		}
		return Promise.resolve();
	}
}));

const { sendWaiting, NOT_A_HELPER, SIGNED_OUT } = await import('$lib/booth/sync');

const sale = (id: string): Queued => ({
	kind: 'sale',
	id,
	fairId: 7,
	queuedAt: 1,
	totalMinor: 1500,
	payload: {
		id,
		at: '2026-12-05T10:00:00Z',
		lines: [{ pieceSlug: 'rosette', woodSlug: 'basswood', quantity: 1 }],
		discountMinor: 0,
		method: 'cash',
		tenderedMinor: 2000
	}
});
const order = (id: string): Queued => ({
	kind: 'order',
	id,
	fairId: 7,
	queuedAt: 2,
	totalMinor: 4000,
	payload: {
		id,
		at: '2026-12-05T10:05:00Z',
		pieceSlug: 'rosette',
		woodSlug: 'basswood',
		initials: 'AB',
		name: 'A buyer',
		email: 'buyer@example.com',
		country: 'US',
		delivery: 'collect',
		depositMinor: 1000,
		method: 'cash'
	}
});

/** A fake server answering every request with the given status, and counting the calls. */
function server(status: number, body: unknown = { error: 'Not for you.' }) {
	const calls: string[] = [];
	const fetcher = ((url: string) => {
		calls.push(url);
		return Promise.resolve(
			new Response(JSON.stringify(body), {
				status,
				headers: { 'content-type': 'application/json' }
			})
		);
	}) as unknown as typeof fetch;
	return { calls, fetcher };
}

beforeEach(() => {
	box.waiting = [];
	box.refused = [];
});

describe('a refusal of the person, not the entry', () => {
	it.each([
		[403, NOT_A_HELPER],
		[401, SIGNED_OUT]
	])('%i on a booth order stops, says so plainly and keeps it waiting', async (status, said) => {
		box.waiting = [order('o1'), order('o2')];
		const { calls, fetcher } = server(status);
		const r = await sendWaiting(7, fetcher);
		expect(r.stopped).toBe(said);
		expect(r.refused).toBe(0);
		expect(box.refused).toEqual([]);
		expect(box.waiting.map((q) => q.id)).toEqual(['o1', 'o2']);
		// Stopped at the first answer: the second would only be told the same.
		expect(calls).toHaveLength(1);
	});

	it.each([
		[403, NOT_A_HELPER],
		[401, SIGNED_OUT]
	])(
		'%i on a batch of sales stops before the orders and keeps all waiting',
		async (status, said) => {
			box.waiting = [sale('s1'), order('o1')];
			const { calls, fetcher } = server(status);
			const r = await sendWaiting(7, fetcher);
			expect(r.stopped).toBe(said);
			expect(box.waiting.map((q) => q.id).sort()).toEqual(['o1', 's1']);
			expect(calls).toEqual(['/api/booth/7/sales']);
		}
	);

	it('sends them once the owner has named the helper', async () => {
		box.waiting = [order('o1')];
		await sendWaiting(7, server(403).fetcher);
		const r = await sendWaiting(7, server(200, {}).fetcher);
		expect(r).toMatchObject({ sent: 1, refused: 0 });
		expect(r.stopped).toBeUndefined();
		expect(box.waiting).toEqual([]);
	});

	it('still moves aside an entry the server refuses for what it says (422)', async () => {
		box.waiting = [order('o1')];
		const r = await sendWaiting(
			7,
			server(422, { error: 'That piece is not on the stall.' }).fetcher
		);
		expect(r.refused).toBe(1);
		expect(box.refused.map((q) => q.error)).toEqual(['That piece is not on the stall.']);
	});
});
