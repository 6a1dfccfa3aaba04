/**
 * Refuses to run a public shop with the local stand-in secrets. Every secret below has a
 * default so `npm start` and the tests need no set-up; in production those defaults are public
 * (they are in the README), so anyone could sign payment events or order links with them.
 * OWASP ASVS 4.0 V14.1 / V2.10.4: no default or shared secrets in a deployed build.
 * Kept free of SvelteKit imports so scripts and tests can call it.
 */
type Env = Record<string, string | undefined>;

/** The public local defaults, as in `config.ts` and `.env.example`. */
const SECRETS: { name: string; local: string[]; what: string }[] = [
	{ name: 'STRIPE_SECRET_KEY', local: ['sk_test_chipstall_local'], what: 'the payment API key' },
	{
		name: 'STRIPE_WEBHOOK_SECRET',
		local: ['whsec_chipstall_local'],
		what: 'the payment events signing secret'
	},
	{
		name: 'LINK_SECRET',
		local: ['chipstall-local-link-secret'],
		what: "the buyers' order-link secret"
	},
	{ name: 'S3_ACCESS_KEY_ID', local: ['S3RVER'], what: 'the photo storage access key' },
	{ name: 'S3_SECRET_ACCESS_KEY', local: ['S3RVER'], what: 'the photo storage secret key' }
];
const LOCAL_DB_PASSWORD = 'chipstall-local';

/** Production: NODE_ENV=production, or a public https origin. */
export function isProduction(env: Env = process.env): boolean {
	return env.NODE_ENV === 'production' || (env.ORIGIN ?? '').toLowerCase().startsWith('https:');
}

/** One line per secret that is unset or still at its local default; empty when all is well. */
export function secretProblems(env: Env = process.env): string[] {
	const out: string[] = [];
	for (const s of SECRETS) {
		const v = env[s.name];
		if (!v) out.push(`${s.name} is not set: set ${s.what} before starting in production.`);
		else if (s.local.includes(v))
			out.push(`${s.name} is the local default: set the real ${s.what.replace(/^the /, '')}.`);
	}
	const dbPassword = env.DATABASE_URL ? passwordIn(env.DATABASE_URL) : env.DB_PASSWORD;
	const dbName = env.DATABASE_URL ? 'DATABASE_URL' : 'DB_PASSWORD';
	if (!dbPassword)
		out.push(`${dbName} has no database password: set one before starting in production.`);
	else if (dbPassword === LOCAL_DB_PASSWORD)
		out.push(`${dbName} uses the local default database password: set the real one.`);
	return out;
}

function passwordIn(url: string): string {
	try {
		return decodeURIComponent(new URL(url).password);
	} catch {
		return '';
	}
}

/**
 * Called when the server starts: in production with any problem, prints them (one line each)
 * and exits with status 1 before the server listens.
 */
export function refuseDefaultSecrets(env: Env = process.env): void {
	if (!isProduction(env)) return;
	const problems = secretProblems(env);
	if (problems.length === 0) return;
	console.error('Chipstall will not start in production with these secrets:');
	for (const p of problems) console.error(`  ${p}`);
	process.exit(1);
}
