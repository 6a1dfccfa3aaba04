/**
 * Which database the tests may use. `npm test` drops and recreates its database, and the tests
 * write orders, accounts and stock, so they must never reach the demo shop's (`npm start`'s)
 * database or any other. Only a name starting `chipstall_test` is accepted, checked by
 * scripts/test.ts before it drops anything, by vitest's setup file (tests/helpers/test-database.ts)
 * before any test file loads, and by playwright.config.ts.
 */
export const DEFAULT_TEST_DB = 'chipstall_test';

/** True for a name the tests may drop and fill: `chipstall_test` or `chipstall_test_<anything>`. */
export const isTestDatabaseName = (name: string) => /^chipstall_test(_\w+)?$/.test(name);

type Env = Record<string, string | undefined>;

/** The database the test command uses: TEST_DB_NAME, or `chipstall_test`. Throws on any other. */
export function testDatabaseName(env: Env): string {
	const name = env.TEST_DB_NAME || DEFAULT_TEST_DB;
	if (!isTestDatabaseName(name))
		throw new Error(
			`TEST_DB_NAME is "${name}": the tests drop and refill their database, so its name must start with "${DEFAULT_TEST_DB}" (for example ${DEFAULT_TEST_DB}_yourname).`
		);
	return name;
}

/** The database named by DATABASE_URL, or else DB_NAME; undefined when neither is set. */
export function namedDatabase(env: Env): string | undefined {
	if (env.DATABASE_URL) return decodeURIComponent(new URL(env.DATABASE_URL).pathname.slice(1));
	return env.DB_NAME || undefined;
}

/**
 * Points `env` at the test database, or throws when it already names another one. With nothing
 * set (a bare `npx vitest`), DB_NAME becomes the test database; an explicit DATABASE_URL or
 * DB_NAME that names any other database (the demo shop's `chipstall`) is refused, not rewritten,
 * so nobody believes they tested against the database they named.
 */
export function requireTestDatabase(env: Env): string {
	const named = namedDatabase(env);
	if (named === undefined) {
		env.DB_NAME = testDatabaseName(env);
		return env.DB_NAME;
	}
	if (!isTestDatabaseName(named))
		throw new Error(
			`The tests refuse the database "${named}" (from ${env.DATABASE_URL ? 'DATABASE_URL' : 'DB_NAME'}): they write and delete rows, so they run only against a test database whose name starts with "${DEFAULT_TEST_DB}". Run them with \`npm test -- unit\` or \`npm test -- e2e\`, which use TEST_DB_NAME (default ${DEFAULT_TEST_DB}).`
		);
	return named;
}
