import { asc, eq } from 'drizzle-orm';
import { db } from '../db';
import { pieces } from '../db/schema';
import { cachedCatalogue } from '../catalogue/cache';

/** The address of every piece on sale, for the sitemap; cached until the catalogue changes. */
export function activePieceSlugs(): Promise<string[]> {
	return cachedCatalogue('sitemap-slugs', async () =>
		(
			await db
				.select({ slug: pieces.slug })
				.from(pieces)
				.where(eq(pieces.active, true))
				.orderBy(asc(pieces.id))
		).map((r) => r.slug)
	);
}
