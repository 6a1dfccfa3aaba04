/**
 * The shop at the address the buyer typed: the same server reached as 127.0.0.1 instead of
 * localhost sends page requests on to ORIGIN, so forms work; a form posted from anywhere else is
 * refused (OWASP CSRF Prevention Cheat Sheet: verify the Origin header against the target origin)
 * with a page that says why and links to the shop's own address, not a bare "403".
 */
import { expect, test } from '@playwright/test';
import { demoAccount } from '../helpers/auth';

/** The test server under its other loopback name (RFC 6761 §6.3: localhost is the loopback). */
function otherName(baseURL: string) {
	const u = new URL(baseURL);
	u.hostname = u.hostname === '127.0.0.1' ? 'localhost' : '127.0.0.1';
	return u.origin;
}

test('the app opened at 127.0.0.1 reaches a working form at the configured origin', async ({
	page,
	baseURL
}) => {
	const origin = new URL(baseURL!).origin;
	await page.goto(`${otherName(baseURL!)}/shop?from=typed`);
	await expect(page).toHaveURL(`${origin}/shop?from=typed`);

	await page.goto(`${otherName(baseURL!)}/shop/rosette-bottle-holder`);
	await expect(page).toHaveURL(`${origin}/shop/rosette-bottle-holder`);
	const section = page.getByRole('region', { name: 'Carved with your initials' });
	await section.getByRole('textbox', { name: 'Initials' }).fill('HM');
	await page.getByRole('button', { name: 'Add to basket with these initials' }).click();
	await expect(page.getByTestId('cart-count')).toHaveText('1');

	await page.goto(`${otherName(baseURL!)}/signin`);
	await expect(page).toHaveURL(`${origin}/signin`);
	const buyer = demoAccount('customer');
	await page.getByLabel('E-mail').fill(buyer.email);
	await page.getByLabel('Password').fill(buyer.password);
	await page.getByRole('button', { name: 'Sign in' }).click();
	await expect(page).toHaveURL(`${origin}/account`);
});

test('page requests under another name are redirected with their query; posts are not', async ({
	request,
	baseURL
}) => {
	const other = otherName(baseURL!);
	const origin = new URL(baseURL!).origin;
	for (const method of ['GET', 'HEAD'] as const) {
		const res = await request.fetch(`${other}/shop/rosette-bottle-holder?wood=cherry`, {
			method,
			maxRedirects: 0
		});
		// RFC 9110 §15.4.9: 308 Permanent Redirect keeps the method.
		expect(res.status(), method).toBe(308);
		expect(res.headers()['location']).toBe(`${origin}/shop/rosette-bottle-holder?wood=cherry`);
	}
	// Webhooks and other API posts are answered where they arrive (a bad signature here: 400).
	const hook = await request.post(`${other}/api/payments/webhook`, {
		data: { id: 'evt_x' },
		maxRedirects: 0
	});
	expect(hook.status()).toBe(400);
});

test('a form posted from another origin gets a plain page linking to the right address', async ({
	page,
	baseURL
}) => {
	const origin = new URL(baseURL!).origin;
	const elsewhere = 'http://elsewhere.test';
	// A page on another site with a form aimed at the shop's sign-in.
	await page.route(`${elsewhere}/**`, (route) =>
		route.fulfill({
			contentType: 'text/html',
			body: `<form method="post" action="${origin}/signin"><input name="email" value="a@b.test"><input name="password" value="x"><button>Send</button></form>`
		})
	);
	await page.goto(`${elsewhere}/form`);
	const [answer] = await Promise.all([
		page.waitForResponse((r) => r.url() === `${origin}/signin` && r.request().method() === 'POST'),
		page.getByRole('button', { name: 'Send' }).click()
	]);
	expect(answer.status()).toBe(403);
	await expect(
		page.getByRole('heading', { name: 'Open the shop at its own address' })
	).toBeVisible();
	await expect(page.getByText(`sent from ${elsewhere}`)).toBeVisible();
	await expect(page.getByText('Nothing was changed.')).toBeVisible();
	await page.getByTestId('right-address').click();
	await expect(page).toHaveURL(`${origin}/signin`);
	await expect(page.getByLabel('E-mail')).toBeVisible();
});

test('the refusal answers in the shape each sender reads', async ({ request, baseURL }) => {
	const origin = new URL(baseURL!).origin;
	const from = otherName(baseURL!);
	// Under /api/: JSON { error }, like every other API refusal.
	const api = await request.post('/api/cart', {
		headers: { 'content-type': 'text/plain', origin: from },
		data: 'slug=rosette-bottle-holder'
	});
	expect(api.status()).toBe(403);
	const apiBody = (await api.json()) as { error: string };
	expect(apiBody.error).toContain(origin);

	// A `use:enhance` form: an action error result the page shows, with the address to use.
	const enhanced = await request.post('/signin', {
		form: { email: 'a@b.test', password: 'x' },
		headers: { origin: from, accept: 'application/json', 'x-sveltekit-action': 'true' }
	});
	expect(enhanced.status()).toBe(403);
	const result = (await enhanced.json()) as {
		type: string;
		error: { message: string; address: string };
	};
	expect(result.type).toBe('error');
	expect(result.error.address).toBe(`${origin}/signin`);
	expect(result.error.message).toContain(`sent from ${from}`);

	// As strict as before: no Origin at all on a form post is refused too; one from the origin is not.
	const bare = await request.post('/signin', {
		form: { email: 'a@b.test', password: 'x' },
		headers: { accept: 'text/html' },
		maxRedirects: 0
	});
	expect(bare.status()).toBe(403);
	const own = await request.post('/signin', {
		form: { email: 'a@b.test', password: 'x' },
		headers: { origin, accept: 'text/html' },
		maxRedirects: 0
	});
	expect(own.status()).not.toBe(403);
});

test('a use:enhance form refused for its origin shows why, not nothing', async ({
	page,
	baseURL
}) => {
	const origin = new URL(baseURL!).origin;
	const from = otherName(baseURL!);
	await page.goto('/signin');
	await page.waitForLoadState('networkidle');
	// As if the page had been opened under the other name before the redirect could happen.
	// (The browser will not send a forged Origin itself, so the post is sent on with one.)
	await page.route(`${origin}/signin`, async (route) => {
		if (route.request().method() !== 'POST') return route.continue();
		const response = await route.fetch({ headers: { ...route.request().headers(), origin: from } });
		await route.fulfill({ response });
	});
	const buyer = demoAccount('customer');
	await page.getByLabel('E-mail').fill(buyer.email);
	await page.getByLabel('Password').fill(buyer.password);
	await page.getByRole('button', { name: 'Sign in' }).click();
	await expect(
		page.getByRole('heading', { name: 'Open the shop at its own address' })
	).toBeVisible();
	await expect(page.getByTestId('error-message')).toContainText(`sent from ${from}`);
	await page.unrouteAll();
	await page.getByTestId('right-address').click();
	await expect(page).toHaveURL(`${origin}/signin`);
	await expect(page.getByLabel('E-mail')).toBeVisible();
});
