import { eq } from 'drizzle-orm';
import { db, type Db, type Tx } from '../db';
import { settings } from '../db/schema';

/** Sales tax on online orders, in basis points; none unless the owner sets it. */
export async function getSalesTaxBp(conn: Db | Tx = db): Promise<number> {
	const [row] = await conn.select().from(settings).where(eq(settings.key, 'salesTax')).limit(1);
	if (!row) return 0;
	const rateBp = (row.value as { rateBp?: unknown } | null)?.rateBp;
	return typeof rateBp === 'number' && Number.isInteger(rateBp) && rateBp >= 0 ? rateBp : 0;
}

export async function setSalesTaxBp(rateBp: number) {
	await db
		.insert(settings)
		.values({ key: 'salesTax', value: { rateBp } })
		.onDuplicateKeyUpdate({ set: { value: { rateBp } } });
}
