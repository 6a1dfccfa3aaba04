import { BOOTH_CHUNK, BOOTH_CHUNK_BYTES, type SyncAnswer } from './sync-message';
import { chunkByLimits } from './chunks';
import {
	refuse,
	settle,
	waiting,
	type Queued,
	type QueuedDiscard,
	type QueuedOrder,
	type QueuedSale,
	type QueuedVoid
} from './outbox';

export type SyncResult = {
	sent: number;
	refused: number;
	late: number;
	offline: boolean;
	stopped?: string;
};

/** Said when the server will not take anything from this phone yet; the entries keep waiting. */
export const NOT_A_HELPER = 'You are not named as a helper for this fair: ask the owner.';
export const SIGNED_OUT = 'Sign in again to send.';

/**
 * A 401 or 403 is about the person, not the entry: signed out, or not (yet) named a helper for
 * this fair. Nothing is refused for good then, since the owner can name them and it sends.
 */
function notAllowed(res: Response): string | null {
	if (res.status === 401) return SIGNED_OUT;
	if (res.status === 403) return NOT_A_HELPER;
	return null;
}

/**
 * Sends what waits in the outbox: sales in batches that fit the route's limits, then booth
 * orders, voids and discards one by one (a void after its sale). A network failure or a 5xx
 * leaves everything queued for the next try; a refusal of the whole batch (signed out, not a
 * helper of this fair) stops and says why; a refused entry is moved aside with its reason.
 */
export async function sendWaiting(
	fairId: number,
	fetcher: typeof fetch = fetch
): Promise<SyncResult> {
	const all = await waiting(fairId);
	const sales = all.filter((q): q is QueuedSale => q.kind === 'sale');
	const others = all.filter(
		(q): q is QueuedOrder | QueuedVoid | QueuedDiscard => q.kind !== 'sale'
	);
	const result: SyncResult = { sent: 0, refused: 0, late: 0, offline: false };
	for (const chunk of chunkByLimits(sales, BOOTH_CHUNK, BOOTH_CHUNK_BYTES)) {
		let res: Response;
		try {
			res = await fetcher(`/api/booth/${fairId}/sales`, {
				method: 'POST',
				headers: { 'content-type': 'application/json' },
				body: JSON.stringify({ sales: chunk.map((q) => q.payload) })
			});
		} catch {
			return { ...result, offline: true };
		}
		if (!res.ok) return { ...result, stopped: notAllowed(res) ?? (await reason(res)) };
		const answer = (await res.json()) as SyncAnswer;
		await settle([...answer.accepted, ...answer.duplicate]);
		const byId = new Map<string, Queued>(chunk.map((q) => [q.id, q]));
		const bad = answer.rejected.flatMap((r) => {
			const entry = r.id ? byId.get(r.id) : undefined;
			return entry ? [{ entry, error: r.error, conflict: r.conflict }] : [];
		});
		await refuse(bad);
		result.sent += answer.accepted.length + answer.duplicate.length;
		result.late += answer.late.length;
		result.refused += bad.length;
	}
	const path = { order: 'orders', void: 'voids', discard: 'discards' } as const;
	for (const q of others) {
		let res: Response;
		try {
			res = await fetcher(`/api/booth/${fairId}/${path[q.kind]}`, {
				method: 'POST',
				headers: { 'content-type': 'application/json' },
				body: JSON.stringify(q.payload)
			});
		} catch {
			return { ...result, offline: true };
		}
		const stop = notAllowed(res);
		if (stop) return { ...result, stopped: stop };
		if (res.ok) {
			await settle([q.id]);
			result.sent++;
		} else if (res.status >= 400 && res.status < 500) {
			await refuse([{ entry: q, error: await reason(res), conflict: res.status === 409 }]);
			result.refused++;
		} else return { ...result, stopped: await reason(res) };
	}
	return result;
}

async function reason(res: Response): Promise<string> {
	try {
		const body = (await res.json()) as { error?: string };
		return body.error ?? `The server answered ${res.status}.`;
	} catch {
		return `The server answered ${res.status}.`;
	}
}
