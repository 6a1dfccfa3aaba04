import type { MySql2Database } from 'drizzle-orm/mysql2';
import type * as schema from '../../src/lib/server/db/schema';
import { demoPhotos } from './photos';
import { demoReadyBy } from './ready-by';
import { demoBoothOrder } from './fairs';

export type SeedDb = MySql2Database<typeof schema>;

/** What the demo seed hands each extra step once its transaction has committed. */
export type DemoSeedResult = {
	pieceIds: Record<string, number>;
	woodIds: Record<string, number>;
	userIds: Record<string, string>;
};

export type DemoExtra = {
	name: string;
	run: (db: SeedDb, seeded: DemoSeedResult) => Promise<void>;
};

/**
 * Steps that run after the demo data is committed and need more than the database (photos
 * uploaded to the S3 stand-in, for instance). Add a step here; a failing step is reported and
 * does not undo the demo data.
 */
// The booth order joins the carving queue, so it comes before the queue dates the orders.
export const demoExtras: DemoExtra[] = [demoPhotos, demoBoothOrder, demoReadyBy];
