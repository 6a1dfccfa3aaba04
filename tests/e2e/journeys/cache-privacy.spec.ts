/**
 * The page cache serves the public pages to everyone, signed in or with a basket too, so nothing
 * personal may ever be in them. A customer signs in and fills a basket, then opens every public
 * page; a visitor without cookies then opens the same addresses (now answered from the cache) and
 * must see none of it: no name, no count, no "Your orders" or "Sign out". The customer still sees
 * their name and count once the header's fragment (/api/me) has loaded, on a phone-sized screen.
 */
import { expect, test, type Page } from '@playwright/test';
import { signInAs } from '../../helpers/auth';
import { personaliseAndAdd } from '../../helpers/buy';

const PUBLIC = [
	'/',
	'/shop',
	'/shop?kind=plate&sort=price-low',
	'/shop/rosette-bottle-holder',
	'/shop/welcome-plate',
	'/care'
];

async function headerShowsCustomer(page: Page, name: string) {
	const nav = page.getByRole('navigation', { name: 'Shop' });
	await expect(page.getByTestId('cart-count')).toHaveText('1');
	await expect(nav.getByRole('link', { name: 'Your orders' })).toBeVisible();
	await expect(nav.getByRole('link', { name: 'Sign in' })).toHaveCount(0);
	if (new URL(page.url()).pathname === '/') {
		await expect(page.getByTestId('signed-in-as')).toHaveText(`Signed in as ${name}.`);
	}
}

async function headerShowsStranger(page: Page, name: string) {
	const nav = page.getByRole('navigation', { name: 'Shop' });
	// Wait for the fragment's answer, then look: the header must stay a stranger's.
	await expect(nav.getByRole('link', { name: 'Sign in' })).toBeVisible();
	await expect(page.getByTestId('cart-count')).toHaveText('0');
	await expect(nav.getByRole('link', { name: 'Your orders' })).toHaveCount(0);
	const text = await page.locator('body').innerText();
	expect(text).not.toContain(name);
	expect(text).not.toMatch(/sign(ed)? out|signed in as/i);
}

test('a signed-in buyer with a basket and a stranger share cached pages; the stranger sees nothing of the buyer', async ({
	browser
}) => {
	test.setTimeout(240_000);
	const buyerCtx = await browser.newContext({ viewport: { width: 390, height: 844 } });
	const buyer = await buyerCtx.newPage();
	const account = await signInAs(buyer, 'customer');
	await personaliseAndAdd(buyer, 'JV');

	for (const address of PUBLIC) {
		await buyer.goto(address);
		await headerShowsCustomer(buyer, account.name);
	}

	const strangerCtx = await browser.newContext({ viewport: { width: 390, height: 844 } });
	const stranger = await strangerCtx.newPage();
	for (const address of PUBLIC) {
		// Twice: the first may render and store, the second is surely the stored page.
		await stranger.goto(address);
		await stranger.reload();
		await headerShowsStranger(stranger, account.name);
		// The bytes as sent, before any script: no name, no session, nothing set.
		const raw = await strangerCtx.request.get(address);
		expect(raw.status()).toBe(200);
		expect(raw.headers()['set-cookie']).toBeUndefined();
		expect(await raw.text()).not.toContain(account.name);
	}
	expect(await strangerCtx.cookies()).toEqual([]);

	// The buyer is answered from the same stored pages (cookies and all), and the header still
	// fills in from the fragment, also after Back and a reload.
	for (const address of PUBLIC) {
		const res = await buyerCtx.request.get(address);
		expect(res.headers()['x-page-cache']).toBe('hit');
		expect(await res.text()).not.toContain(account.name);
	}
	await buyer.goto('/');
	await headerShowsCustomer(buyer, account.name);
	await buyer.goto('/shop/welcome-plate');
	await buyer.goBack();
	await headerShowsCustomer(buyer, account.name);
	await buyer.reload();
	await headerShowsCustomer(buyer, account.name);

	const me = await buyerCtx.request.get('/api/me');
	expect(me.headers()['cache-control']).toBe('private, no-store');
	expect(await me.json()).toEqual({ basketCount: 1, name: account.name, staff: false });

	await buyerCtx.close();
	await strangerCtx.close();
});
