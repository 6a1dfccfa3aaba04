import { eq } from 'drizzle-orm';
import { LRUCache } from 'lru-cache';
import { db } from '../db';
import { catalogueVersion as catalogueVersionRow } from '../db/schema';

/**
 * In-process cache for catalogue reads (the shop list, piece pages, filter options).
 *
 * The catalogue changes only when the owner edits it or stock moves, yet every shop visit read
 * it afresh. Each process now keeps the answers in memory and reads, at most once per
 * `CHECK_MS`, one counter row (`catalogue_version`) that database triggers bump in the same
 * transaction as every write to the tables public pages show (drizzle/0011): a write by this
 * process, another app process, a script or a hand-typed UPDATE changes it, so every process
 * drops its copies within `CHECK_MS` without the writers having to remember anything. Reading
 * one row by primary key costs the same at any catalogue or order history size, and order
 * status moves are not counted, so they never drop the public pages.
 *
 * Prices shown here are never trusted: checkout re-reads and re-prices under lock.
 */
const CHECK_MS = 1000;
/** Entries kept per process; the shop's filter combinations are few, but bound it anyway. */
const MAX_ENTRIES = 500;

let version: string | null = null;
let checkedAt = 0;
let checking: Promise<string> | null = null;
// Least recently used go first, so made-up addresses (a piece slug nobody sells) cannot empty it.
const entries = new LRUCache<string, Promise<unknown>>({ max: MAX_ENTRIES });

/** The counter's value; a missing row (a database restored without it) reads as 0. */
export async function readVersion(): Promise<string> {
	const [row] = await db
		.select({ n: catalogueVersionRow.n })
		.from(catalogueVersionRow)
		.where(eq(catalogueVersionRow.id, 1));
	return String(row?.n ?? 0);
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
	const p = load();
	entries.set(key, p);
	p.catch(() => entries.delete(key));
	return p;
}

/**
 * The version as last read, while that read is under CHECK_MS old; null when it is due again (the
 * page cache's front then leaves the request to SvelteKit, whose handle asks the database).
 */
export function catalogueVersionIfFresh(now = Date.now()): string | null {
	return version !== null && now - checkedAt < CHECK_MS ? version : null;
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
