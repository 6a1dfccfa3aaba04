/**
 * vitest's setup file (vite.config.ts): runs before every test file, in tests/unit and tests/db
 * alike. `npm test` points the tests at its own test database; a bare `npx vitest` is pointed
 * at the default test database; a DATABASE_URL or DB_NAME naming any other database (the demo
 * shop's) is refused, so every test file fails before it can touch it.
 * The rule is in scripts/lib/test-database.ts; tests/unit/test-database.test.ts keeps it.
 */
import { existsSync } from 'node:fs';
import path from 'node:path';
import { requireTestDatabase } from '../../scripts/lib/test-database';

// The scripts read a local .env (scripts/lib/paths.ts) when a test imports one; read it first, so
// a DATABASE_URL there is checked here rather than slipping in later.
const envFile = path.resolve(import.meta.dirname, '../../.env');
if (existsSync(envFile)) process.loadEnvFile(envFile);

requireTestDatabase(process.env);
