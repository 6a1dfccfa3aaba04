import { defineConfig } from 'drizzle-kit';
import { config } from './config/settings';

export default defineConfig({
	dialect: 'mysql',
	schema: './src/lib/server/db/schema.ts',
	out: './drizzle',
	dbCredentials: { url: config.db.url },
	strict: true,
	verbose: true
});
