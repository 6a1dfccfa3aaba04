import { openDB, type DBSchema, type IDBPDatabase } from 'idb';

/**
 * The booth's outbox in IndexedDB: every sale and booth order is written here first, under an
 * id made on the phone, and only removed once the server has answered for it (accepted or
 * already stored). Survives a reload, a locked phone or a closed tab.
 */
export type QueuedSale = {
	kind: 'sale';
	id: string;
	fairId: number;
	queuedAt: number;
	payload: {
		id: string;
		at: string;
		lines: { pieceSlug: string; woodSlug: string; quantity: number }[];
		discountMinor: number;
		method: 'cash' | 'card' | 'other';
		tenderedMinor: number | null;
	};
	/** Amount shown on the phone (the server prices it again). */
	totalMinor: number;
	error?: string;
};
export type QueuedOrder = {
	kind: 'order';
	id: string;
	fairId: number;
	queuedAt: number;
	payload: Record<string, unknown> & { id: string; depositMinor: number; method: string };
	totalMinor: number;
	error?: string;
};
export type Queued = QueuedSale | QueuedOrder;

interface BoothDb extends DBSchema {
	outbox: { key: string; value: Queued; indexes: { fairId: number } };
	refused: { key: string; value: Queued; indexes: { fairId: number } };
}

let dbp: Promise<IDBPDatabase<BoothDb>> | null = null;
function open() {
	dbp ??= openDB<BoothDb>('chipstall-booth', 1, {
		upgrade(db) {
			db.createObjectStore('outbox', { keyPath: 'id' }).createIndex('fairId', 'fairId');
			db.createObjectStore('refused', { keyPath: 'id' }).createIndex('fairId', 'fairId');
		}
	});
	return dbp;
}

export async function enqueue(entry: Queued) {
	await (await open()).put('outbox', entry);
}

export async function waiting(fairId: number): Promise<Queued[]> {
	const all = await (await open()).getAllFromIndex('outbox', 'fairId', fairId);
	return all.sort((a, b) => a.queuedAt - b.queuedAt);
}

export async function refused(fairId: number): Promise<Queued[]> {
	return (await open()).getAllFromIndex('refused', 'fairId', fairId);
}

/** Done with these: the server stored them (or had already). */
export async function settle(ids: string[]) {
	const tx = (await open()).transaction('outbox', 'readwrite');
	await Promise.all([...ids.map((id) => tx.store.delete(id)), tx.done]);
}

/** The server refused these for good: kept, with the reason, for the owner to see. */
export async function refuse(entries: { entry: Queued; error: string }[]) {
	const tx = (await open()).transaction(['outbox', 'refused'], 'readwrite');
	await Promise.all([
		...entries.flatMap(({ entry, error }) => [
			tx.objectStore('refused').put({ ...entry, error }),
			tx.objectStore('outbox').delete(entry.id)
		]),
		tx.done
	]);
}
