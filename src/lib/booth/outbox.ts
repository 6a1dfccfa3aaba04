import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import type { DiscardPayload, OrderPayload, SalePayload, VoidPayload } from './sync-message';

/**
 * The booth's outbox in IndexedDB: every sale, booth order, void and discard is written here
 * first, under an id made on the phone, and only removed once the server has answered for it
 * (accepted or already stored). Survives a reload, a locked phone or a closed tab. Refused
 * entries wait in `refused` for the helper to fix or discard; `recent` keeps what this phone
 * recorded, so a sale can be voided before it was ever sent.
 */
type Common = {
	id: string;
	fairId: number;
	queuedAt: number;
	/** What it was, in words (buyer, pieces), for the refused list and the owner. */
	summary?: string;
	error?: string;
	conflict?: boolean;
};
export type QueuedSale = Common & {
	kind: 'sale';
	payload: SalePayload;
	/** Amount shown on the phone (the server prices it again). */
	totalMinor: number;
};
export type QueuedOrder = Common & {
	kind: 'order';
	payload: OrderPayload;
	totalMinor: number;
};
export type QueuedVoid = Common & {
	kind: 'void';
	payload: VoidPayload;
	totalMinor: number;
};
export type QueuedDiscard = Common & {
	kind: 'discard';
	payload: DiscardPayload;
	totalMinor: number;
};
export type Queued = QueuedSale | QueuedOrder | QueuedVoid | QueuedDiscard;

/** A sale this phone recorded, kept for the day's list and for voiding. */
export type Recent = {
	id: string;
	fairId: number;
	at: string;
	summary: string;
	totalMinor: number;
	voided?: boolean;
};

interface BoothDb extends DBSchema {
	outbox: { key: string; value: Queued; indexes: { fairId: number } };
	refused: { key: string; value: Queued; indexes: { fairId: number } };
	recent: { key: string; value: Recent; indexes: { fairId: number } };
}

let dbp: Promise<IDBPDatabase<BoothDb>> | null = null;
function open() {
	dbp ??= openDB<BoothDb>('chipstall-booth', 2, {
		upgrade(db, oldVersion) {
			if (oldVersion < 1) {
				db.createObjectStore('outbox', { keyPath: 'id' }).createIndex('fairId', 'fairId');
				db.createObjectStore('refused', { keyPath: 'id' }).createIndex('fairId', 'fairId');
			}
			if (oldVersion < 2)
				db.createObjectStore('recent', { keyPath: 'id' }).createIndex('fairId', 'fairId');
		}
	});
	return dbp;
}

/** Stores an entry under its id: the same id stored twice (a double tap) is one entry. */
export async function enqueue(entry: Queued) {
	const db = await open();
	const tx = db.transaction(['outbox', 'recent'], 'readwrite');
	const writes: Promise<unknown>[] = [tx.objectStore('outbox').put(entry)];
	if (entry.kind === 'sale')
		writes.push(
			tx.objectStore('recent').put({
				id: entry.id,
				fairId: entry.fairId,
				at: entry.payload.at,
				summary: entry.summary ?? '',
				totalMinor: entry.totalMinor
			})
		);
	if (entry.kind === 'void') {
		const r = await tx.objectStore('recent').get(entry.payload.saleId);
		if (r) writes.push(tx.objectStore('recent').put({ ...r, voided: true }));
	}
	await Promise.all([...writes, tx.done]);
}

export async function waiting(fairId: number): Promise<Queued[]> {
	const all = await (await open()).getAllFromIndex('outbox', 'fairId', fairId);
	return all.sort((a, b) => a.queuedAt - b.queuedAt);
}

export async function refused(fairId: number): Promise<Queued[]> {
	return (await open()).getAllFromIndex('refused', 'fairId', fairId);
}

export async function recent(fairId: number): Promise<Recent[]> {
	const all = await (await open()).getAllFromIndex('recent', 'fairId', fairId);
	return all.sort((a, b) => b.at.localeCompare(a.at));
}

/** Done with these: the server stored them (or had already). */
export async function settle(ids: string[]) {
	const tx = (await open()).transaction('outbox', 'readwrite');
	await Promise.all([...ids.map((id) => tx.store.delete(id)), tx.done]);
}

/** The server refused these for good: kept, with the reason, for the helper to fix or discard. */
export async function refuse(entries: { entry: Queued; error: string; conflict?: boolean }[]) {
	const tx = (await open()).transaction(['outbox', 'refused', 'recent'], 'readwrite');
	await Promise.all([
		...entries.flatMap(({ entry, error, conflict }) => [
			tx.objectStore('refused').put({ ...entry, error, conflict }),
			tx.objectStore('outbox').delete(entry.id),
			// A refused sale is not a sale: it leaves the day's list (fix it to record it again).
			...(entry.kind === 'sale' && !conflict ? [tx.objectStore('recent').delete(entry.id)] : [])
		]),
		tx.done
	]);
}

/** Takes a refused entry off the list (fixed and recorded again, or discarded). */
export async function forget(id: string) {
	const tx = (await open()).transaction('refused', 'readwrite');
	await Promise.all([tx.store.delete(id), tx.done]);
}
