/**
 * Unit tests never touch the demo shop's database. `npm test` points them at its own test
 * database; a bare `npx vitest` would otherwise reach the development one (`npm start`'s), so it
 * is sent to the default test database instead, and a database test there fails rather than
 * leaving rows in the demo shop.
 */
const e = process.env;
const dbName = e.DATABASE_URL
	? new URL(e.DATABASE_URL).pathname.slice(1)
	: e.DB_NAME || 'chipstall';
if (!dbName.includes('test')) {
	delete e.DATABASE_URL;
	e.DB_NAME = e.TEST_DB_NAME || 'chipstall_test';
}
export {};
