import { BOOTH_CHUNK } from '$lib/schemas/fairs';
import { refuse, settle, waiting, type Queued, type QueuedOrder, type QueuedSale } from './outbox';

export type SyncResult = { sent: number; refused: number; offline: boolean; stopped?: string };

/**
 * Sends what waits in the outbox: sales in batches, booth orders one by one. A network failure
 * or a 5xx leaves everything queued for the next try; a refusal of the whole batch (closed fair,
 * signed out) stops and says why; a refused entry is moved aside with its reason.
 */
export async function sendWaiting(
	fairId: number,
	fetcher: typeof fetch = fetch
): Promise<SyncResult> {
	const all = await waiting(fairId);
	const sales = all.filter((q): q is QueuedSale => q.kind === 'sale');
	const orders = all.filter((q): q is QueuedOrder => q.kind === 'order');
	const result: SyncResult = { sent: 0, refused: 0, offline: false };
	for (let i = 0; i < sales.length; i += BOOTH_CHUNK) {
		const chunk = sales.slice(i, i + BOOTH_CHUNK);
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
		if (!res.ok) return { ...result, stopped: await reason(res) };
		const answer = (await res.json()) as {
			accepted: string[];
			duplicate: string[];
			rejected: { id: string | null; error: string }[];
		};
		await settle([...answer.accepted, ...answer.duplicate]);
		const byId = new Map<string, Queued>(chunk.map((q) => [q.id, q]));
		const bad = answer.rejected.flatMap((r) => {
			const entry = r.id ? byId.get(r.id) : undefined;
			return entry ? [{ entry, error: r.error }] : [];
		});
		await refuse(bad);
		result.sent += answer.accepted.length + answer.duplicate.length;
		result.refused += bad.length;
	}
	for (const q of orders) {
		let res: Response;
		try {
			res = await fetcher(`/api/booth/${fairId}/orders`, {
				method: 'POST',
				headers: { 'content-type': 'application/json' },
				body: JSON.stringify(q.payload)
			});
		} catch {
			return { ...result, offline: true };
		}
		if (res.ok) {
			await settle([q.id]);
			result.sent++;
		} else if (res.status >= 400 && res.status < 500 && res.status !== 401 && res.status !== 409) {
			await refuse([{ entry: q, error: await reason(res) }]);
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
