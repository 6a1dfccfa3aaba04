/**
 * Two visitors without cookies, one after the other, as people arrive: the first clicks around
 * (SvelteKit's client-side navigation, which fetches each page's data as JSON), the second opens
 * the same addresses directly and from a shared filtered link. Both must see the pages — never
 * raw data, never an error page — with Back, Forward, reload and the logo on every public page.
 */
import { expect, test, type Page } from '@playwright/test';

type Stop = { address: string; heading: RegExp };

const HOME: Stop = { address: '/', heading: /Rosettes cut by hand/ };
const SHOP: Stop = { address: '/shop', heading: /^Pieces$/ };
const FILTERED: Stop = { address: '/shop?kind=plate&sort=price-low', heading: /^Pieces$/ };
const PIECE: Stop = { address: '/shop/welcome-plate', heading: /Welcome plate/i };
const CARE: Stop = { address: '/care', heading: /^Care and materials$/ };

/** What the person sees: the page's heading, the shop's frame, no error and no raw data. */
async function seesPage(page: Page, stop: Stop) {
	await expect(page.getByRole('heading', { level: 1 })).toHaveText(stop.heading);
	await expect(page.getByText(/^Error \d{3}$/)).toHaveCount(0);
	await expect(page.getByText(/Internal Error/i)).toHaveCount(0);
	await expect(page.getByRole('navigation', { name: 'Shop' })).toBeVisible();
	// Raw data shows as text starting with `{"type":`; a page never does.
	expect((await page.locator('body').innerText()).trimStart().startsWith('{')).toBe(false);
}

async function seesFilteredPlates(page: Page) {
	await seesPage(page, FILTERED);
	await expect(page.getByLabel('Kind')).toHaveValue('plate');
	await expect(page.getByLabel('Order')).toHaveValue('price-low');
	const cards = page.getByTestId('piece-card');
	await expect(cards.first()).toBeVisible();
	for (const text of await cards.allInnerTexts()) expect(text).toMatch(/plate/i);
}

test('the first visitor clicks around, the second opens the same addresses and sees the pages', async ({
	browser
}) => {
	test.setTimeout(300_000);
	const first = await browser.newContext();
	const a = await first.newPage();
	await a.goto(HOME.address);
	await seesPage(a, HOME);

	// Client-side navigation from here on: every step fetches …/__data.json.
	await a.getByRole('link', { name: 'See the pieces' }).click();
	await expect(a).toHaveURL(/\/shop$/);
	await seesPage(a, SHOP);
	await a.getByLabel('Kind').selectOption('plate');
	await expect(a).toHaveURL(/kind=plate/);
	await a.getByLabel('Order').selectOption('price-low');
	await expect(a).toHaveURL(/sort=price-low/);
	await seesFilteredPlates(a);
	await a
		.getByRole('link', { name: /Welcome plate/i })
		.first()
		.click();
	await expect(a).toHaveURL(/\/shop\/welcome-plate$/);
	await seesPage(a, PIECE);
	await a.getByRole('link', { name: 'Care and materials' }).click();
	await expect(a).toHaveURL(/\/care$/);
	await seesPage(a, CARE);
	expect(await first.cookies()).toEqual([]);

	// Back through everything, then Forward again: each is a data request for a page seen before.
	await a.goBack();
	await seesPage(a, PIECE);
	await a.goBack();
	await seesFilteredPlates(a);
	await a.goBack();
	// The filter form sends all its fields; the order was still the default one here.
	await expect(a).toHaveURL(/kind=plate&wood=&sort=featured$/);
	await seesPage(a, SHOP);
	await a.goBack();
	await seesPage(a, SHOP);
	await a.goBack();
	await seesPage(a, HOME);
	for (const stop of [SHOP, SHOP, FILTERED, PIECE, CARE]) {
		await a.goForward();
		await seesPage(a, stop);
	}

	// The second visitor, no cookies, opens what the first one clicked to, and a shared link.
	const second = await browser.newContext();
	const b = await second.newPage();
	for (const stop of [SHOP, PIECE, CARE, HOME]) {
		const res = await b.goto(stop.address);
		expect(res?.headers()['content-type']).toMatch(/^text\/html/);
		await seesPage(b, stop);
	}
	const shared = await b.goto(`${FILTERED.address}&utm_source=shared-${Date.now()}`);
	expect(shared?.headers()['content-type']).toMatch(/^text\/html/);
	await seesFilteredPlates(b);
	await first.close();
	await second.close();
});

test('Back, Forward, reload and the logo on every public page never show an error', async ({
	browser
}) => {
	test.setTimeout(300_000);
	const stops = [HOME, SHOP, FILTERED, PIECE, CARE];
	for (const round of ['first', 'second']) {
		// Twice, each with fresh cookieless visitors: the second round meets what the first stored.
		const context = await browser.newContext();
		const page = await context.newPage();
		for (const stop of stops) {
			await page.goto(stop.address);
			await seesPage(page, stop);
			await page.reload();
			await seesPage(page, stop);
			// The logo takes the visitor home by client navigation; Back returns, Forward again.
			await page.locator('header').getByRole('link', { name: 'Chipstall' }).click();
			await expect(page).toHaveURL(/\/$/);
			await seesPage(page, HOME);
			// On the home page the logo leads to the same address: no new step to go back from.
			if (stop === HOME) continue;
			await page.goBack();
			await seesPage(page, stop);
			await page.reload();
			await seesPage(page, stop);
			await page.goForward();
			await seesPage(page, HOME);
			await page.reload();
			await seesPage(page, HOME);
		}
		expect(await context.cookies(), round).toEqual([]);
		await context.close();
	}
});
