import { sql } from 'drizzle-orm';
import { db } from './db';

/**
 * In-process cache for catalogue reads (the shop list, piece pages, filter options).
 *
 * The catalogue changes only when the owner edits it or stock moves, yet every shop visit read
 * it afresh. Each process now keeps the answers in memory and asks MariaDB, at most once per
 * `CHECK_MS`, for a checksum of the catalogue tables. Any write to them — by this process,
 * another app process, a script or a hand-typed UPDATE — changes the checksum, so every process
 * drops its copies within `CHECK_MS` without the writers having to remember anything.
 * CHECKSUM TABLE reads each table once; on a handful of small tables that is well under a
 * millisecond, and it is a consistent read that takes no row locks.
 *
 * Prices shown here are never trusted: checkout re-reads and re-prices under lock.
 */
// `settings` too: the public pages cached whole (handles/page-cache.ts) show the shop's name,
// address and away notice; `fairs` for the home page's next fair; `order_history` because every
// status move changes the carving queue, and piece pages date a new piece from that queue.
const CATALOGUE_TABLES = [
	'pieces',
	'piece_woods',
	'photos',
	'stock',
	'woods',
	'settings',
	'fairs',
	'order_history'
];
const CHECK_MS = 1000;
/** Entries kept per process; the shop's filter combinations are few, but bound it anyway. */
const MAX_ENTRIES = 500;

let version: string | null = null;
let checkedAt = 0;
let checking: Promise<string> | null = null;
const entries = new Map<string, Promise<unknown>>();

async function readVersion(): Promise<string> {
	const [rows] = (await db.execute(
		sql.raw(`CHECKSUM TABLE ${CATALOGUE_TABLES.map((t) => `\`${t}\``).join(', ')}`)
	)) as unknown as [{ Checksum: number | string | null }[]];
	return rows.map((r) => String(r.Checksum)).join(':');
}

/** The catalogue's current version, asked of the database at most once per CHECK_MS. */
async function currentVersion(): Promise<string> {
	if (version !== null && Date.now() - checkedAt < CHECK_MS) return version;
	// Requests arriving together share one question to the database.
	checking ??= readVersion().finally(() => (checking = null));
	const v = await checking;
	checkedAt = Date.now();
	if (v !== version) {
		entries.clear();
		version = v;
	}
	return v;
}

/**
 * The cached result of `load` for `key`, computed once per catalogue version. A failed load is
 * not kept, so a database hiccup is retried by the next request.
 */
export async function cachedCatalogue<T>(key: string, load: () => Promise<T>): Promise<T> {
	await currentVersion();
	const hit = entries.get(key) as Promise<T> | undefined;
	if (hit) return hit;
	if (entries.size >= MAX_ENTRIES) entries.clear();
	const p = load();
	entries.set(key, p);
	p.catch(() => entries.delete(key));
	return p;
}

/** A strong validator for HTTP caching of pages built from the catalogue alone. */
export async function catalogueVersion(): Promise<string> {
	return currentVersion();
}

/** Forgets everything (tests, and a writer that wants its own change visible at once). */
export function clearCatalogueCache() {
	entries.clear();
	version = null;
	checkedAt = 0;
}
