import { expect, test, type Page } from '@playwright/test';
import { signInAs } from '../../helpers/auth';

/**
 * The carver's own clock and money: the demo shop keeps America/New_York (its town is in
 * Vermont); no workshop page says UTC; switching settings to EUR and de-DE rewrites every price
 * in the shop with no code change, and switching back restores it.
 */

const WORKSHOP_PAGES = [
	'/workshop',
	'/workshop/orders',
	'/workshop/queue',
	'/workshop/fairs',
	'/workshop/reports'
];

async function saveFormat(page: Page, locale: string, currency: string) {
	await page.goto('/workshop/settings');
	await page.getByLabel('Language and region').selectOption(locale);
	await page.getByLabel('Currency').selectOption(currency);
	const form = page.locator('form[action="?/format"]');
	// A double click writes the same settings twice: harmless, and one "Saved." shows.
	await form.getByRole('button', { name: 'Save' }).dblclick();
	await expect(form.getByRole('status')).toHaveText('Saved.');
}

test.describe('the shop clock and money', () => {
	test.use({ viewport: { width: 1280, height: 800 } });
	// Many pages in one walk, on a machine shared by several builds.
	test.setTimeout(120_000);

	test('no workshop page shows UTC; the zone is picked from a list with the time there', async ({
		page
	}) => {
		await signInAs(page, 'owner');
		for (const path of WORKSHOP_PAGES) {
			await page.goto(path);
			await expect(page.locator('main')).not.toContainText(/\bUTC\b|GMT/);
		}
		// A fair's report and an order's history, too.
		await page.goto('/workshop/fairs');
		const fair = page.locator('a[href^="/workshop/fairs/"]').first();
		const fairHref = (await fair.getAttribute('href'))!.match(/\/workshop\/fairs\/\d+/)![0];
		await page.goto(`${fairHref}/report`);
		await expect(page.locator('main')).toContainText('Takings by hour');
		await expect(page.locator('main')).not.toContainText(/\bUTC\b/);
		await page.goto('/workshop/orders');
		await page.locator('a[href^="/workshop/orders/CS-"]').first().click();
		await expect(page.locator('main')).not.toContainText(/\bUTC\b|GMT/);

		await page.goto('/workshop/settings');
		// "UTC" is one of the zones offered; it is said nowhere else on the page.
		for (const text of await page.locator('main :is(p, h1, h2, label, legend)').allInnerTexts())
			expect(text).not.toMatch(/\bUTC\b|GMT/);
		const zone = page.getByLabel('Time zone');
		await expect(zone).toHaveValue('America/New_York');
		// The time there now, from the same clock the list shows.
		const hereNow = new Date().toLocaleString('en-US', {
			hour: 'numeric',
			minute: '2-digit',
			timeZone: 'America/New_York'
		});
		await expect(page.getByTestId('zone-now')).toContainText(hereNow.slice(0, -6));
		await zone.selectOption('Pacific/Auckland');
		await expect(page.getByTestId('zone-now')).not.toContainText(hereNow);
		// Reload: nothing was saved, the shop's zone is still New York.
		await page.reload();
		await expect(page.getByLabel('Time zone')).toHaveValue('America/New_York');
	});

	test('EUR and de-DE write every price the German way; switching back restores dollars', async ({
		page,
		browser
	}) => {
		await signInAs(page, 'owner');
		try {
			await saveFormat(page, 'de-DE', 'EUR');
			await expect(page.getByTestId('money-sample')).toContainText('1.234,56 €');

			// A visitor with no cookies on a phone sees the shop in euros.
			const phone = await browser.newContext({ viewport: { width: 390, height: 844 } });
			const buyer = await phone.newPage();
			await buyer.goto('/shop');
			const prices = buyer.getByTestId('card-from-price');
			await expect(prices.first()).toContainText('€');
			for (const t of await prices.allInnerTexts()) {
				expect(t).toMatch(/^\D*\d{1,3}(\.\d{3})*,\d{2}\s€$/);
				expect(t).not.toContain('$');
			}
			await buyer.getByTestId('piece-card').first().click();
			await expect(buyer.getByTestId('from-price')).toContainText('€');
			await buyer.goBack();
			await expect(buyer.getByTestId('card-from-price').first()).toContainText('€');
			await phone.close();

			// Orders already taken keep their dollars, written the German way.
			await page.goto('/workshop/orders');
			await expect(page.locator('main')).toContainText(/\d,\d{2}\s\$/);
		} finally {
			await saveFormat(page, 'en-US', 'USD');
		}
		await page.goto('/shop');
		await expect(page.getByTestId('card-from-price').first()).toContainText('$');
		await expect(page.locator('main')).not.toContainText('€');
	});
});
