/**
 * The shop's own details kept in the settings table: name, contact e-mail and return address,
 * closed dates, and the policies page. Each read falls back to a safe default when unset or
 * malformed, so a page never fails on a missing setting.
 */
import { today as todayIso } from '$lib/dates';
import { eq } from 'drizzle-orm';
import { db, type Db, type Tx } from './db';
import { settings, type Address } from './db/schema';
import {
	away as awaySchema,
	policies as policiesSchema,
	shopInfo as shopInfoSchema,
	type Away,
	type Policies,
	type ShopInfo
} from '$lib/schemas/settings';
import type { z } from 'zod';

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

export const setShopInfo = (v: ShopInfo) => write('shop', v);
export const setAway = (v: Away) => write('away', v);
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
