/**
 * The workshop's frame: a helper refused an owner's page is told what they can do instead, and on
 * a phone every tab of the workshop's nav can be reached.
 */
import { expect, test } from '@playwright/test';
import { signInAs } from '../helpers/auth';

test('a helper opening an owner page is told what it needs and what they can do', async ({
	page
}) => {
	const helper = await signInAs(page, 'helper');
	for (const path of ['/workshop/reports', '/workshop/settings']) {
		const res = await page.goto(path);
		expect(res?.status(), path).toBe(403);
		await expect(page.getByRole('heading', { name: 'This page is for the owner' })).toBeVisible();
		const message = page.getByTestId('error-message');
		await expect(message).toContainText(`signed in as ${helper.name}, a helper`);
		// Not the advice meant for someone signed in with a shop account.
		await expect(page.getByText(/sign in again/i)).toHaveCount(0);
		await expect(page.getByRole('navigation', { name: 'Workshop' })).toBeVisible();
	}
	await page.getByRole('main').getByRole('link', { name: 'Back to Today' }).click();
	await expect(page).toHaveURL((u) => u.pathname === '/workshop');
	await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
});

test('a shop account opening the workshop still gets the sign-in advice', async ({ page }) => {
	await signInAs(page, 'customer');
	const res = await page.goto('/workshop');
	expect(res?.status()).toBe(403);
	await expect(page.getByText(/sign in again with your workshop account/)).toBeVisible();
});

test('on a phone every workshop tab can be reached', async ({ page }, info) => {
	// iPhone 12–15 CSS viewport, 390 × 844 (from memory).
	await page.setViewportSize({ width: 390, height: 844 });
	await signInAs(page, 'owner');
	const nav = page.getByRole('navigation', { name: 'Workshop' });
	const links = nav.getByRole('link');
	const names = await links.allTextContents();
	expect(names).toContain('Settings');
	expect(names.length).toBe(9);
	for (let i = 0; i < names.length; i++) {
		const link = links.nth(i);
		// Wholly on the screen, with no scrolling sideways.
		const box = (await link.boundingBox())!;
		expect(box.x, names[i]).toBeGreaterThanOrEqual(0);
		expect(box.x + box.width, names[i]).toBeLessThanOrEqual(390);
		await expect(link).toBeInViewport({ ratio: 1 });
	}
	// Nor does the page itself run wider than the phone.
	expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
	await page.screenshot({ path: info.outputPath('workshop-phone-nav.png') });
	await nav.getByRole('link', { name: 'Settings' }).click();
	await expect(page).toHaveURL((u) => u.pathname === '/workshop/settings');
});
