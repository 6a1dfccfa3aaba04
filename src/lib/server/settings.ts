import { eq } from 'drizzle-orm';
import { db, type Db, type Tx } from './db';
import { settings } from './db/schema';
import { jsonValue } from './json-column';

/** Sales tax on online orders, in basis points; none unless the owner sets it. */
export async function getSalesTaxBp(conn: Db | Tx = db): Promise<number> {
	const [row] = await conn.select().from(settings).where(eq(settings.key, 'salesTax')).limit(1);
	if (!row) return 0;
	const v = jsonValue<{ rateBp?: unknown }>(row.value);
	return Number.isInteger(v?.rateBp) && (v.rateBp as number) >= 0 ? (v.rateBp as number) : 0;
}

export async function setSalesTaxBp(rateBp: number) {
	await db
		.insert(settings)
		.values({ key: 'salesTax', value: { rateBp } })
		.onDuplicateKeyUpdate({ set: { value: { rateBp } } });
}
