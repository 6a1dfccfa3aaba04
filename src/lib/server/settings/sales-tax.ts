/**
 * The online sales tax setting (rate and basis), kept in the settings table under `salesTax`.
 * A missing or malformed value reads as no tax, per line; a value saved before the basis could
 * be chosen (`{ rateBp }` alone) reads as per line, as orders were then taxed.
 */
import { eq } from 'drizzle-orm';
import { db, type Db, type Tx } from '../db';
import { settings } from '../db/schema';
import { salesTaxSetting, type SalesTaxSetting } from '$lib/settings/settings-schema';
import { DEFAULT_TAX_BASIS } from '$lib/tax/sales-tax';

const KEY = 'salesTax';
export const NO_SALES_TAX: SalesTaxSetting = { rateBp: 0, basis: DEFAULT_TAX_BASIS };

/** The rate (basis points) and basis online orders are taxed at; none unless the owner sets it. */
export async function getSalesTax(conn: Db | Tx = db): Promise<SalesTaxSetting> {
	const [row] = await conn.select().from(settings).where(eq(settings.key, KEY)).limit(1);
	if (!row) return NO_SALES_TAX;
	const parsed = salesTaxSetting.safeParse(row.value);
	return parsed.success ? parsed.data : NO_SALES_TAX;
}

export async function setSalesTax(v: SalesTaxSetting) {
	const value = { rateBp: v.rateBp, basis: v.basis };
	await db.insert(settings).values({ key: KEY, value }).onDuplicateKeyUpdate({ set: { value } });
}
