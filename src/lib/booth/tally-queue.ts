import { openDB, type DBSchema, type IDBPDatabase } from 'idb';

/**
 * The tally's own store on the phone (apart from the sales outbox): what is typed into the count
 * is kept as a draft, so a reload or a locked phone loses nothing, and each save waits in a queue
 * under an id made on the phone until the server has answered for it.
 */
export type TallyFields = Record<string, string>;
export type QueuedTally = {
	id: string;
	fairId: number;
	day: string;
	fields: TallyFields;
	queuedAt: number;
};

interface TallyDb extends DBSchema {
	drafts: { key: string; value: { key: string; fields: TallyFields } };
	outbox: { key: string; value: QueuedTally; indexes: { fairId: number } };
}

let dbp: Promise<IDBPDatabase<TallyDb>> | null = null;
function open() {
	dbp ??= openDB<TallyDb>('chipstall-tally', 1, {
		upgrade(db) {
			db.createObjectStore('drafts', { keyPath: 'key' });
			db.createObjectStore('outbox', { keyPath: 'id' }).createIndex('fairId', 'fairId');
		}
	});
	return dbp;
}

const draftKey = (fairId: number, day: string) => `${fairId}/${day}`;

export async function keepDraft(fairId: number, day: string, fields: TallyFields) {
	await (await open()).put('drafts', { key: draftKey(fairId, day), fields });
}

export async function draft(fairId: number, day: string): Promise<TallyFields | null> {
	return (await (await open()).get('drafts', draftKey(fairId, day)))?.fields ?? null;
}

export async function dropDraft(fairId: number, day: string) {
	await (await open()).delete('drafts', draftKey(fairId, day));
}

export async function queueTally(entry: QueuedTally) {
	await (await open()).put('outbox', entry);
}

export async function waitingTallies(fairId: number): Promise<QueuedTally[]> {
	const all = await (await open()).getAllFromIndex('outbox', 'fairId', fairId);
	return all.sort((a, b) => a.queuedAt - b.queuedAt);
}

export type TallySend = {
	sent: number;
	offline: boolean;
	/** The server said no (wrong figures, counted twice, closed): the reason, to show. */
	refused?: string;
	fields?: Record<string, string[]>;
};

/**
 * Sends the waiting counts, oldest first. No signal or a 5xx keeps them for the next try; a
 * refusal drops the queued save (its draft stays, so the helper can fix it and save again).
 */
export async function sendTallies(
	fairId: number,
	fetcher: typeof fetch = fetch
): Promise<TallySend> {
	const result: TallySend = { sent: 0, offline: false };
	for (const q of await waitingTallies(fairId)) {
		let res: Response;
		try {
			res = await fetcher(`/api/booth/${fairId}/tally`, {
				method: 'POST',
				headers: { 'content-type': 'application/json' },
				body: JSON.stringify({ id: q.id, day: q.day, fields: q.fields })
			});
		} catch {
			return { ...result, offline: true };
		}
		const db = await open();
		if (res.ok) {
			await db.delete('outbox', q.id);
			await dropDraft(fairId, q.day);
			result.sent++;
			continue;
		}
		let body: { error?: string; fields?: Record<string, string[]> } = {};
		try {
			body = (await res.json()) as typeof body;
		} catch {
			/* not JSON: the status says enough */
		}
		if (res.status >= 500 || res.status === 401)
			return {
				...result,
				refused: body.error ?? `The server answered ${res.status}; trying again later.`
			};
		await db.delete('outbox', q.id);
		return {
			...result,
			refused: body.error ?? `The server answered ${res.status}.`,
			fields: body.fields
		};
	}
	return result;
}
