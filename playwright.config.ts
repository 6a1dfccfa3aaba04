import { defineConfig } from '@playwright/test';
import { requireTestDatabase } from './scripts/lib/test-database';

/**
 * Run through `npm test` (scripts/test.ts), which starts MariaDB and the stand-ins, seeds the
 * test database, builds the app into CHIPSTALL_BUILD_DIR and sets PORT/ORIGIN for it.
 * Drives Debian's Chromium; never `playwright install`.
 */
// The specs buy, sign up and sell: never against the demo shop's database (a bare
// `npx playwright test` names none, so it is refused too; `npm test -- e2e` sets the test one).
if (!process.env.DATABASE_URL && !process.env.DB_NAME)
	throw new Error(
		'Run the end-to-end tests with `npm test -- e2e`, which gives them a test database.'
	);
requireTestDatabase(process.env);

const port = Number(process.env.PORT || 3100);
const origin = process.env.ORIGIN || `http://localhost:${port}`;
const buildDir = process.env.CHIPSTALL_BUILD_DIR || 'build';

export default defineConfig({
	testDir: 'tests/e2e',
	timeout: 30_000,
	expect: { timeout: 5_000 },
	fullyParallel: false,
	workers: 1,
	retries: 0,
	reporter: [['list']],
	outputDir: `.data/playwright/${process.env.DB_NAME || 'results'}`,
	use: {
		baseURL: origin,
		trace: 'retain-on-failure',
		screenshot: 'only-on-failure',
		launchOptions: {
			executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium',
			args: [
				'--no-sandbox',
				'--disable-gpu',
				'--disable-background-networking',
				'--disable-component-update',
				'--disable-sync',
				'--no-first-run'
			]
		}
	},
	webServer: {
		command: `node ${buildDir}`,
		url: `${origin}/`,
		// Photo uploads need more than adapter-node's 512 kB default body limit, as npm start sets.
		env: {
			BODY_SIZE_LIMIT: '32M',
			...(process.env as Record<string, string>),
			PORT: String(port),
			ORIGIN: origin
		},
		reuseExistingServer: false,
		timeout: 60_000,
		stdout: 'pipe',
		stderr: 'pipe'
	}
});
