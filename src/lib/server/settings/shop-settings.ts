/**
 * The shop's own details kept in the settings table: name, contact e-mail and return address,
 * closed dates, the policies page, and the shop's clock, money and words. Each read falls back to a safe default when unset or
 * malformed, so a page never fails on a missing setting.
 */
import { isoDay, today as todayIso } from '$lib/locale/dates';
import { and, eq, gt, isNull, ne } from 'drizzle-orm';
import { db, type Db, type Tx } from '../db';
import { transact } from '../db/retry';
import { replanQueue } from '../queue/carving-queue';
import { fairs, pieces, settings, type Address } from '../db/schema';
import {
	away as awaySchema,
	policies as policiesSchema,
	shopFormat as shopFormatSchema,
	shopInfo as shopInfoSchema,
	shopWords as shopWordsSchema,
	type Away,
	type Policies,
	type ShopInfo
} from '$lib/settings/settings-schema';
import type { z } from 'zod';
import {
	DEFAULT_FORMAT,
	DEFAULT_WORDS,
	useShopFormat,
	useShopWords,
	type ShopFormat,
	type ShopWords
} from '$lib/locale/shop-format';

export const DEFAULT_SHOP: ShopInfo = {
	name: 'Chipstall',
	email: 'shop@chipstall.test',
	address: {
		name: 'Chipstall',
		line1: '',
		line2: '',
		city: '',
		region: '',
		postcode: '',
		country: 'US'
	}
};
const DEFAULT_AWAY: Away = { until: '', note: '' };
const DEFAULT_POLICIES: Policies = { returnsDays: 30, extra: '' };

async function read<T>(key: string, schema: z.ZodType<T>, fallback: T, conn: Db | Tx): Promise<T> {
	const [row] = await conn.select().from(settings).where(eq(settings.key, key)).limit(1);
	if (!row) return fallback;
	const parsed = schema.safeParse(row.value);
	return parsed.success ? parsed.data : fallback;
}

async function write(key: string, value: unknown) {
	await db.insert(settings).values({ key, value }).onDuplicateKeyUpdate({ set: { value } });
}

export const getShopInfo = (conn: Db | Tx = db) => read('shop', shopInfoSchema, DEFAULT_SHOP, conn);
export const getAway = (conn: Db | Tx = db) => read('away', awaySchema, DEFAULT_AWAY, conn);
export const getPolicies = (conn: Db | Tx = db) =>
	read('policies', policiesSchema, DEFAULT_POLICIES, conn);

export const getShopFormat = (conn: Db | Tx = db) =>
	read('format', shopFormatSchema, DEFAULT_FORMAT, conn);
export const getShopWords = (conn: Db | Tx = db) =>
	read('workshop', shopWordsSchema, DEFAULT_WORDS, conn);

export const setShopInfo = (v: ShopInfo) => write('shop', v);

/**
 * Loads the shop's clock, money and words into this process (`$lib/locale/shop-format`): once at start
 * and after every save, so formatters never read the database. Defaults when unreachable.
 */
export async function loadShopProfile(conn: Db | Tx = db) {
	const [format, words] = await Promise.all([getShopFormat(conn), getShopWords(conn)]);
	useShopFormat(format);
	useShopWords(words);
	return { format, words };
}

/**
 * Saves the clock, locale and currency. A new currency relabels the catalogue and the fairs not
 * yet begun (the numbers stay: prices are not converted); orders and past fairs keep the
 * currency they were taken in.
 */
const PROFILE_CHECK_MS = 1000;
let profileCheckedAt = 0;
let profileLoading: Promise<unknown> | null = null;

/**
 * Reloads the shop's clock, money and words at most once a second, so a save made through another
 * app process (or by hand) reaches this one within about a second. Never fails a request: on a
 * database error the values held stay.
 */
export async function freshShopProfile(now = Date.now()) {
	if (now - profileCheckedAt < PROFILE_CHECK_MS) return;
	profileLoading ??= loadShopProfile()
		.catch(() => undefined)
		.finally(() => {
			profileCheckedAt = Date.now();
			profileLoading = null;
		});
	await profileLoading;
}

export async function setShopFormat(v: ShopFormat) {
	await transact(async (tx) => {
		await tx
			.insert(settings)
			.values({ key: 'format', value: v })
			.onDuplicateKeyUpdate({ set: { value: v } });
		await tx.update(pieces).set({ currency: v.currency }).where(ne(pieces.currency, v.currency));
		await tx
			.update(fairs)
			.set({ currency: v.currency })
			.where(
				and(
					ne(fairs.currency, v.currency),
					isNull(fairs.closedAt),
					gt(fairs.startsOn, isoDay(new Date(), v.timeZone))
				)
			);
	});
	useShopFormat(v);
	// "Today" may now be another day: every queued order's date is worked out again.
	await replanQueue();
}
export async function setShopWords(v: ShopWords) {
	await write('workshop', v);
	useShopWords(v);
}
/** Away days are days off for the carving queue: every queued order's date moves. */
export async function setAway(v: Away) {
	await write('away', v);
	await replanQueue();
}
export const setPolicies = (v: Policies) => write('policies', v);

/** The away notice to show today, or null once the return day has come. */
export function awayNotice(a: Away, today = todayIso()) {
	if (!a.until || a.until <= today) return null;
	return { until: a.until, note: a.note };
}

/** The lines of an address as printed on slips and pages. */
export function addressLines(a: Address & { name?: string }) {
	return [
		a.name,
		a.line1,
		a.line2,
		[a.city, [a.region, a.postcode].filter(Boolean).join(' ')].filter(Boolean).join(', '),
		a.country
	].filter((l): l is string => !!l && l.trim() !== '');
}
