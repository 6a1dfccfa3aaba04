import { expect, test } from '@playwright/test';
import sharp from 'sharp';
import { signInAs } from '../helpers/auth';

/**
 * The owner adds two photos to a piece at once, watches each one's progress bar, and the shop
 * shows them through <picture> in the new sizes (400, 800 and 1600 px wide, WebP and JPEG).
 */
test.describe.configure({ timeout: 90_000 });

const photo = (r: number, g: number, b: number) =>
	sharp({ create: { width: 2000, height: 1500, channels: 3, background: { r, g, b } } })
		.jpeg({ quality: 90 })
		.toBuffer();

test('the owner uploads two photos and the shop shows them in the new sizes', async ({ page }) => {
	await signInAs(page, 'owner', '/workshop/pieces');
	await page.getByRole('link', { name: 'Welcome plate' }).click();
	await expect(page.getByRole('heading', { name: 'Welcome plate', level: 1 })).toBeVisible();

	// Hold each answer back a moment so the bars can be seen full before "Stored" appears.
	await page.route('**/api/uploads', async (route) => {
		await new Promise((r) => setTimeout(r, 1200));
		await route.continue();
	});
	await page.getByLabel('Photos to upload').setInputFiles([
		{ name: 'plate-front.jpg', mimeType: 'image/jpeg', buffer: await photo(170, 110, 70) },
		{ name: 'plate-back.jpg', mimeType: 'image/jpeg', buffer: await photo(120, 80, 50) }
	]);
	const uploads = page.getByTestId('upload');
	await expect(uploads).toHaveCount(2);
	for (const name of ['plate-front.jpg', 'plate-back.jpg']) {
		const bar = page.getByRole('progressbar', { name: `Upload of ${name}` });
		await expect(bar).toBeVisible();
		await expect
			.poll(
				async () => Number(await bar.getAttribute('value')) / Number(await bar.getAttribute('max'))
			)
			.toBe(1);
	}
	await expect(uploads.filter({ hasText: 'Stored' })).toHaveCount(2, { timeout: 20_000 });
	await page.unroute('**/api/uploads');
	await expect(page.getByLabel(/Describe photo/)).toHaveCount(4); // two demo photos + two new

	await page.goto('/shop/welcome-plate');
	for (const name of ['plate-front', 'plate-back']) {
		await page.getByRole('button', { name: new RegExp(`Show photo \\d: .*${name}`) }).click();
		const main = page.getByRole('img', { name: new RegExp(name) });
		await expect(main).toBeVisible();
		const picture = main.locator('xpath=..');
		const webp = await picture.locator('source[type="image/webp"]').getAttribute('srcset');
		const jpg = await main.getAttribute('srcset');
		const key = /\/photos\/(pieces\/welcome-plate\/[a-f0-9]+)\/400\.webp/.exec(webp ?? '')![1];
		expect(webp).toBe([400, 800, 1600].map((w) => `/photos/${key}/${w}.webp ${w}w`).join(', '));
		expect(jpg).toBe([400, 800, 1600].map((w) => `/photos/${key}/${w}.jpg ${w}w`).join(', '));
		// The browser picked one of them and decoded it.
		await expect
			.poll(() => main.evaluate((img: HTMLImageElement) => img.naturalWidth))
			.toBeGreaterThan(0);
		// Each variant is served at its stated width, cached for good.
		for (const w of [400, 800, 1600]) {
			for (const ext of ['webp', 'jpg']) {
				const res = await page.request.get(`/photos/${key}/${w}.${ext}`);
				expect(res.status()).toBe(200);
				expect(res.headers()['cache-control']).toContain('immutable');
				const meta = await sharp(await res.body()).metadata();
				expect(meta.width).toBe(w);
				expect(meta.format).toBe(ext === 'jpg' ? 'jpeg' : 'webp');
			}
		}
	}
});
