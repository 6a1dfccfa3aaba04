import type { MySql2Database } from 'drizzle-orm/mysql2';
import type * as schema from '../../src/lib/server/db/schema';

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
