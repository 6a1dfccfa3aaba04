/**
 * The hardening cases against the built server, over real HTTP. Sources named beside each group:
 * OWASP ASVS 4.0 (V2 authentication, V3 session, V5 validation, V14 configuration), the OWASP
 * cheat sheets "Unvalidated Redirects and Forwards" and "Content Security Policy", RFC 6585
 * (429, 431) and RFC 9110 (413).
 */
import { spawn } from 'node:child_process';
import { expect, test, type Page } from '@playwright/test';
import { signInAs, signInWith } from '../helpers/auth';

const unique = (tag: string) =>
	`${tag}-${Date.now()}-${Math.floor(Math.random() * 1e6)}@example.test`;

test.describe('redirects stay on the site (OWASP unvalidated redirects; ASVS V5.1.5)', () => {
	const PROBES = [
		'/.//evil.example',
		'/..//evil.example',
		'/a/..//evil.example',
		'/%2e//evil.example',
		'/./\\evil.example'
	];

	test('signed in, GET /signin and GET /signup with a bypass `next` land on our own site', async ({
		page,
		request,
		baseURL
	}) => {
		await signInAs(page, 'customer');
		const cookies = await page.context().cookies();
		const cookie = cookies.map((c) => `${c.name}=${c.value}`).join('; ');
		for (const next of PROBES) {
			for (const path of ['/signin', '/signup']) {
				const res = await request.get(`${path}?next=${encodeURIComponent(next)}`, {
					headers: { cookie },
					maxRedirects: 0
				});
				expect(res.status(), `${path} ${next}`).toBe(303);
				const location = res.headers()['location'];
				// WHATWG URL resolution, as the browser does it, must stay on our origin.
				expect(new URL(location, baseURL).origin, `${path} ${next} → ${location}`).toBe(
					new URL(baseURL!).origin
				);
				expect(location.startsWith('//')).toBe(false);
			}
		}
	});

	test('POST /signin with a bypass `next` lands on the account page', async ({ page }) => {
		for (const next of PROBES.slice(0, 2)) {
			await page.context().clearCookies();
			await signInWith(page, 'juniper@example.test', 'demo-customer-2026', next);
			await expect(page).toHaveURL((u) => u.pathname === '/account');
		}
	});
});

test.describe('security headers on every kind of response (OWASP CSP cheat sheet; ASVS V14.4)', () => {
	const expectCommon = (h: Record<string, string>, what: string) => {
		expect(h['x-content-type-options'], what).toBe('nosniff');
		expect(h['referrer-policy'], what).toBe('strict-origin-when-cross-origin');
		expect(h['permissions-policy'], what).toContain('camera=()');
		expect(h['content-security-policy'], what).toContain("frame-ancestors 'none'");
	};

	test('page, API, PDF, photo-404, error page and 429 all carry them', async ({
		request,
		page
	}) => {
		const home = await request.get('/');
		expectCommon(home.headers(), 'page');
		const csp = home.headers()['content-security-policy'];
		// The inline script is allowed by its hash (the same bytes every time, so cached pages keep it).
		expect(csp).toMatch(/script-src 'self' 'sha256-[^']+'/);
		expect(csp).not.toMatch(/script-src[^;]*'unsafe-inline'/);
		expect(home.headers()['strict-transport-security']).toBeUndefined(); // plain http here

		expectCommon(
			(await request.get('/api/pattern?diameter=60&width=100&length=100')).headers(),
			'API'
		);
		expectCommon((await request.get('/api/no-such-thing')).headers(), 'API 404');
		expectCommon((await request.get('/no-such-page')).headers(), 'error page');
		expectCommon((await request.get('/photos/pieces/none/640.webp')).headers(), 'photo 404');

		await signInAs(page, 'owner');
		const pdf = await page.request.get(
			'/workshop/layout/template.pdf?diameter=70&count=1&width=100&length=150'
		);
		expect(pdf.status()).toBe(200);
		expect(pdf.headers()['content-type']).toContain('application/pdf');
		expectCommon(pdf.headers(), 'PDF');
	});

	test('HSTS is sent when the request came over https', async ({ request }) => {
		// adapter-node takes the protocol from ORIGIN; an https ORIGIN is tested in the
		// spawned-server test below, so here only the header's absence on http is checked.
		expect((await request.get('/')).headers()['strict-transport-security']).toBeUndefined();
	});
});

/** Collects Content-Security-Policy violations the page reports. */
async function watchCsp(page: Page) {
	await page.addInitScript(() => {
		(window as unknown as { __csp: string[] }).__csp = [];
		document.addEventListener('securitypolicyviolation', (e) =>
			(window as unknown as { __csp: string[] }).__csp.push(
				`${e.violatedDirective} ${e.blockedURI}`
			)
		);
	});
	return () => page.evaluate(() => (window as unknown as { __csp: string[] }).__csp ?? []);
}

test.describe('the personaliser, the planner and the payment page work under the policy', () => {
	test.describe.configure({ timeout: 90_000 });

	test('personaliser redraws with no CSP violation', async ({ page }) => {
		const violations = await watchCsp(page);
		await page.goto('/shop/rosette-bottle-holder', { waitUntil: 'networkidle' });
		const section = page.getByRole('region', { name: 'Carved with your initials' });
		await section.getByRole('textbox', { name: 'Initials' }).fill('HM');
		await expect(
			page.getByTestId('personaliser-preview').locator('svg > title').first()
		).toContainText('initials HM');
		expect(await violations()).toEqual([]);
	});

	test('planner recounts with no CSP violation', async ({ page }) => {
		const violations = await watchCsp(page);
		await signInAs(page, 'owner');
		await page.goto('/workshop/layout', { waitUntil: 'networkidle' });
		await page.getByLabel('How many').fill('1');
		await expect(page.getByTestId('planner-chips')).toHaveText('12');
		expect(await violations()).toEqual([]);
	});

	test('checkout to the payment page and back, paid, with no CSP violation', async ({ page }) => {
		const violations = await watchCsp(page);
		await page.goto('/shop/rosette-bottle-holder', { waitUntil: 'networkidle' });
		const section = page.getByRole('region', { name: 'Carved with your initials' });
		await section.getByRole('textbox', { name: 'Initials' }).fill('CSP');
		await page.getByRole('button', { name: 'Add to basket with these initials' }).click();
		await expect(page.getByTestId('added-notice')).toBeVisible();
		await page.goto('/cart');
		await page.getByTestId('to-checkout').click();
		await page.getByLabel('Name', { exact: true }).fill('Rowan Policy');
		await page.getByLabel('E-mail').fill(unique('csp'));
		await page.getByLabel('Street address').fill('2 Weir Lane');
		await page.getByLabel('Town or city').fill('Boulder');
		await page.getByLabel('State or region').fill('CO');
		await page.getByLabel('Postcode or ZIP').fill('80302');
		expect(await violations()).toEqual([]);
		await page.getByTestId('pay').click();
		await expect(page.getByRole('heading', { name: 'Pay by card' })).toBeVisible();
		// Stripe's published test card that succeeds.
		await page.getByLabel('Card number').fill('4242 4242 4242 4242');
		await page.getByLabel('Expiry (MM/YY)').fill('12/34');
		await page.getByLabel('Security code').fill('123');
		await page.getByLabel('Name on card').fill('Rowan Policy');
		await page.getByRole('button', { name: /^Pay / }).click();
		await expect(page).toHaveURL(/\/checkout\/done\?session_id=/);
		await expect(page.getByTestId('order-paid')).toBeVisible({ timeout: 15_000 });
		expect(await violations()).toEqual([]);
	});
});

test.describe('throttling (ASVS V2.2.1; RFC 6585 §4: 429 with Retry-After)', () => {
	test('the 11th wrong password for one account from one address gets 429, Retry-After and a plain sentence', async ({
		request,
		page,
		baseURL
	}) => {
		test.slow();
		const email = unique('target');
		const post = () =>
			request.post('/signin', {
				form: { email, password: 'wrong guess' },
				headers: { origin: baseURL!, accept: 'text/html' },
				maxRedirects: 0
			});
		// 10 per account and address per window (src/lib/server/http/throttles.ts, signInPair).
		for (let i = 0; i < 10; i++) expect((await post()).status()).toBe(400);
		const res = await post();
		expect(res.status()).toBe(429);
		expect(Number(res.headers()['retry-after'])).toBeGreaterThan(0);
		expect(await res.text()).toContain('Too many tries. Please wait');

		await signInWith(page, email, 'wrong guess');
		await expect(page.getByRole('alert')).toContainText('Too many tries. Please wait');
	});

	test('the sixth reset e-mail to one address in the window gets 429', async ({
		request,
		baseURL
	}) => {
		const email = unique('resetflood');
		const post = () =>
			request.post('/reset', {
				form: { email },
				headers: { origin: baseURL!, accept: 'text/html' }
			});
		for (let i = 0; i < 5; i++) expect((await post()).status()).toBe(200);
		const res = await post();
		expect(res.status()).toBe(429);
		expect(res.headers()['retry-after']).toBeTruthy();
	});
});

test.describe('bad input answers 4xx with a message (ASVS V5.1; RFC 9110 §15.5.14; RFC 6585 §5)', () => {
	test('/api/pattern with a 100 KB query answers 431 with a JSON message', async ({ baseURL }) => {
		const res = await fetch(`${baseURL}/api/pattern?diameter=60&x=${'a'.repeat(100_000)}`);
		expect(res.status).toBe(431);
		expect(res.headers.get('content-type')).toContain('application/json');
		expect(((await res.json()) as { error: string }).error).toMatch(/too long/);
	});

	test('POST /api/cart with a 20 MB body answers 413 with a plain message', async ({ baseURL }) => {
		const res = await fetch(`${baseURL}/api/cart`, {
			method: 'POST',
			headers: { 'content-type': 'application/json', origin: baseURL! },
			body: '{"slug":"' + 'x'.repeat(20 * 1024 * 1024) + '"}'
		});
		expect(res.status).toBe(413);
		expect(((await res.json()) as { error: string }).error).toMatch(/too large/);
	});

	test('a 5,000-character photo key answers 404', async ({ request }) => {
		const res = await request.get(`/photos/pieces/${'a'.repeat(5000)}/640.webp`);
		expect(res.status()).toBe(404);
	});

	test('a product slug with a NUL byte is 404, not another piece', async ({ request }) => {
		expect((await request.get('/shop/rosette-bottle-holder')).status()).toBe(200);
		expect((await request.get('/shop/rosette-bottle-holder%00')).status()).toBe(404);
	});

	test('a 10 KB password is told it is too long', async ({ page }) => {
		await signInWith(page, 'juniper@example.test', 'p'.repeat(10_000));
		await expect(page.locator('#password-error')).toContainText('at most 200 characters');
	});
});

test.describe('production refuses default secrets (ASVS V14.1)', () => {
	const buildDir = process.env.CHIPSTALL_BUILD_DIR || 'build';
	const SECRET_NAMES = [
		'STRIPE_SECRET_KEY',
		'STRIPE_WEBHOOK_SECRET',
		'LINK_SECRET',
		'S3_ACCESS_KEY_ID',
		'S3_SECRET_ACCESS_KEY',
		'DB_PASSWORD'
	];

	function startBuilt(env: Record<string, string | undefined>, port: number) {
		const base = { ...process.env };
		for (const n of [...SECRET_NAMES, 'DATABASE_URL']) delete base[n];
		const child = spawn(process.execPath, [buildDir], {
			env: { ...base, PORT: String(port), ...env },
			stdio: ['ignore', 'pipe', 'pipe']
		});
		let out = '';
		child.stdout.on('data', (d) => (out += d));
		child.stderr.on('data', (d) => (out += d));
		return { child, output: () => out };
	}

	test('NODE_ENV=production with the local defaults: exits 1, one line per secret', async () => {
		const { child, output } = startBuilt({ NODE_ENV: 'production' }, 39871);
		const code = await new Promise<number | null>((r) => child.on('exit', r));
		expect(code).toBe(1);
		for (const n of SECRET_NAMES) expect(output()).toContain(n);
		expect(output()).not.toContain('Listening on');
	});

	test('an https ORIGIN with real secrets starts, and pages carry HSTS', async () => {
		const port = 39872;
		const { child, output } = startBuilt(
			{
				NODE_ENV: 'production',
				ORIGIN: `https://localhost:${port}`,
				STRIPE_SECRET_KEY: 'sk_live_not_a_default',
				STRIPE_WEBHOOK_SECRET: 'whsec_not_a_default',
				LINK_SECRET: 'a-long-random-link-secret-for-this-test',
				S3_ACCESS_KEY_ID: 'AKIATESTKEY',
				S3_SECRET_ACCESS_KEY: 'not-the-default',
				DB_PASSWORD: 'not-the-default'
			},
			port
		);
		try {
			await expect.poll(output, { timeout: 20_000 }).toContain('Listening on');
			// adapter-node takes the protocol from ORIGIN: this request counts as https.
			const res = await fetch(`http://localhost:${port}/care`);
			expect(res.headers.get('strict-transport-security')).toContain('max-age=');
		} finally {
			child.kill('SIGTERM');
		}
	});
});
