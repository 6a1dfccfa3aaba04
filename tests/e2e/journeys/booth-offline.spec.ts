import { expect, test, type Browser, type Page } from '@playwright/test';
import { demoAccount, signInAs } from '../../helpers/auth';

/**
 * A helper at the booth on a phone, the signal coming and going: the owner sets up a fair and
 * names the helper; the helper opens the booth and the tally with signal, loses it, taps around
 * the workshop (an offline page, never an error; Back works), counts the tally blind without
 * signal, reloads, gets the signal back (the count arrives), is told the tin is short and counts
 * again. Then the owner closes the fair, asked first.
 */
test.use({ viewport: { width: 390, height: 844 }, hasTouch: true });

const KEPT = 'chipstall-booth-pages';

/** The owner, at a desk: a one-day fair today with a 100.00 float and two ornaments, Wren named. */
async function ownerSetsUpFair(page: Page) {
	await signInAs(page, 'owner');
	const name = `Offline Orchard Fair ${Date.now() % 100000}`;
	const today = new Date().toISOString().slice(0, 10);
	await page.goto('/workshop/fairs');
	await page.getByLabel('Name').fill(name);
	await page.getByLabel('Place').fill('Orchard Barn, Łódź');
	await page.getByLabel('First day').fill(today);
	await page.getByLabel('Last day').fill(today);
	await page.getByLabel('Cash float').fill('100');
	await page.getByRole('button', { name: 'Add the fair' }).click();
	await expect(page).toHaveURL(/\/workshop\/fairs\/\d+$/);
	const fairUrl = new URL(page.url()).pathname;
	await page.getByLabel('Take Rosette ornament, Basswood').fill('2');
	await page.getByRole('button', { name: 'Load out' }).click();
	await expect(page.getByRole('status')).toContainText('Loaded out 2 pieces');
	await page.getByLabel(new RegExp(demoAccount('helper').name)).check();
	await page.getByRole('button', { name: 'Save who sells' }).click();
	await expect(page.getByRole('status')).toContainText('1 helper sells here');
	return { name, fairUrl };
}

async function phone(browser: Browser) {
	const context = await browser.newContext({
		viewport: { width: 390, height: 844 },
		hasTouch: true,
		isMobile: true
	});
	return { context, page: await context.newPage() };
}

/** Waits until the service worker controls the page and has kept these addresses. */
async function waitKept(page: Page, paths: string[]) {
	await page.waitForFunction(() => navigator.serviceWorker.controller !== null, null, {
		timeout: 30_000
	});
	await page.waitForFunction(
		async ({ cacheName, wanted }) => {
			const cache = await caches.open(cacheName);
			const hits = await Promise.all(wanted.map((p) => cache.match(p)));
			return hits.every(Boolean);
		},
		{ cacheName: KEPT, wanted: paths },
		{ timeout: 30_000, polling: 250 }
	);
}

async function expectOfflinePage(page: Page) {
	await expect(page.getByRole('heading', { name: 'No signal' })).toBeVisible();
	await expect(page.getByText('What works without signal')).toBeVisible();
	await expect(page.getByText(/Error \d+/)).toHaveCount(0);
}

test('a helper works the booth and the tally without signal', async ({ page, browser }) => {
	test.setTimeout(180_000);
	const { name, fairUrl } = await ownerSetsUpFair(page);
	const booth = `${fairUrl}/booth`;
	const tally = `${fairUrl}/tally`;

	const { context, page: helper } = await phone(browser);
	await signInAs(helper, 'helper');

	// With signal: the installed app's start page lists the fair; booth and tally open once.
	await helper.goto('/workshop/booth');
	await expect(helper.getByRole('heading', { name: 'At the booth' })).toBeVisible();
	await helper
		.getByRole('listitem')
		.filter({ hasText: name })
		.getByRole('link', { name: 'Tally' })
		.click();
	await expect(helper.getByRole('heading', { name: 'Tally' })).toBeVisible();
	await helper.reload();
	await helper.goto(booth);
	await expect(helper.getByTestId('offline-ready')).toBeVisible({ timeout: 30_000 });
	await helper.reload();
	await helper.goto('/workshop/booth');
	await helper.goto(tally);
	await helper.goto(booth);
	await waitKept(helper, [
		booth,
		`${booth}/__data.json`,
		tally,
		`${tally}/__data.json`,
		'/workshop/booth'
	]);

	// No signal. Tapping "Fairs" from the booth shows the offline page, and Back returns.
	await context.setOffline(true);
	await expect(helper.getByTestId('net-status')).toHaveText('Offline');
	await helper
		.getByRole('navigation', { name: 'Workshop' })
		.getByRole('link', { name: 'Fairs' })
		.click();
	await expectOfflinePage(helper);
	await expect(helper.getByTestId('kept-pages')).toContainText(name);
	await helper.goBack();
	await expect(helper.getByRole('heading', { name })).toBeVisible();
	await expect(helper.getByTestId('net-status')).toHaveText('Offline');
	// Another workshop link, then the same address typed in (a full load): offline page again.
	await helper
		.getByRole('navigation', { name: 'Workshop' })
		.getByRole('link', { name: 'Orders' })
		.click();
	await expectOfflinePage(helper);
	await helper.goBack();
	await expect(helper.getByRole('heading', { name })).toBeVisible();
	await helper.goto('/workshop/fairs');
	await expectOfflinePage(helper);
	await helper.goBack();
	await expect(helper.getByRole('heading', { name })).toBeVisible();
	// The start page is kept too.
	await helper.goto('/workshop/booth');
	await expect(helper.getByRole('heading', { name: 'At the booth' })).toBeVisible();

	// The tally without signal: a blind count (nothing expected shown), 5.00 short.
	await helper.goto(tally);
	await expect(helper.getByRole('heading', { name: 'Tally' })).toBeVisible();
	await expect(helper.getByRole('columnheader', { name: 'Expected' })).toHaveCount(0);
	const count = helper.getByLabel('Counted Rosette ornament · Basswood');
	// WCAG 2.5.5 (Target Size): at least 44 by 44 CSS pixels.
	const box = await count.boundingBox();
	expect(box!.width).toBeGreaterThanOrEqual(44);
	expect(box!.height).toBeGreaterThanOrEqual(44);
	await count.fill('2');
	await helper.getByLabel('Cash counted in the tin').fill('95.00');
	await helper.getByRole('button', { name: 'Save the counts' }).click();
	await expect(helper.getByTestId('tally-kept')).toContainText('kept on this phone');
	// Reloaded without signal, the phone still holds the counts.
	await helper.reload();
	await expect(helper.getByLabel('Counted Rosette ornament · Basswood')).toHaveValue('2');
	await expect(helper.getByLabel('Cash counted in the tin')).toHaveValue('95.00');
	await expect(helper.getByTestId('tally-kept')).toContainText('waiting for signal');

	// Signal back: the count arrives, and only now is it compared with what was expected.
	const arrived = helper.waitForResponse(
		(r) => /\/api\/booth\/\d+\/tally$/.test(r.url()) && r.ok()
	);
	await context.setOffline(false);
	await arrived;
	await expect(helper.getByTestId('tally-check')).toContainText(
		'Counts saved. The tin is $5.00 short — count again?',
		{ timeout: 20_000 }
	);
	await expect(helper.getByRole('columnheader', { name: 'Expected' })).toBeVisible();
	await expect(helper.getByTestId('expected')).toHaveText('2');
	// A helper never sees the money totals, only the gap.
	await expect(helper.getByText('Net for the fair')).toHaveCount(0);

	// One recount: blind again, then it adds up; no third count for the helper.
	await helper.getByRole('button', { name: 'Count again' }).click();
	await expect(helper.getByLabel('Cash counted in the tin')).toHaveValue('');
	await expect(helper.getByRole('columnheader', { name: 'Expected' })).toHaveCount(0);
	await helper.getByLabel('Counted Rosette ornament · Basswood').fill('2');
	await helper.getByLabel('Cash counted in the tin').fill('100.00');
	await helper.getByRole('button', { name: 'Save the recount' }).dblclick();
	await expect(helper.getByTestId('tally-check')).toContainText('It adds up');
	await expect(helper.getByRole('button', { name: /Save the/ })).toHaveCount(0);
	await expect(helper.getByText('Counted twice: the owner can correct')).toBeVisible();
	await helper.reload();
	await expect(helper.getByTestId('day-cash-difference')).toContainText('The tin matches');
	await expect(helper.getByTestId('day-cash-difference')).toContainText('first count $95.00');
	await context.close();

	// The owner closes the fair, asked first, told about the helper's phone.
	await page.goto(tally);
	await page.getByRole('button', { name: 'Close the fair…' }).click();
	const confirm = page.getByTestId('close-confirm');
	await expect(confirm).toContainText(`${demoAccount('helper').name}'s phone`);
	await expect(confirm).toContainText('may still hold sales');
	await page.getByRole('button', { name: 'Not yet' }).click();
	await expect(confirm).toHaveCount(0);
	await page.getByRole('button', { name: 'Close the fair…' }).click();
	await page.getByRole('button', { name: 'Yes, close the fair' }).click();
	await expect(page.getByText('Closed: unsold pieces went back to the workshop.')).toBeVisible();
});

test('the installed app starts at a kept page and has PNG icons', async ({ request }) => {
	const manifest = (await (await request.get('/booth.webmanifest')).json()) as {
		start_url: string;
		icons: { src: string; sizes: string; type: string }[];
	};
	expect(manifest.start_url).toBe('/workshop/booth');
	for (const size of [192, 512]) {
		const icon = manifest.icons.find((i) => i.sizes === `${size}x${size}`);
		expect(icon?.type).toBe('image/png');
		const png = await (await request.get(icon!.src)).body();
		// PNG (ISO/IEC 15948): the 8-byte signature, then IHDR with width and height at 16 and 20.
		expect(png.subarray(0, 8).toString('hex')).toBe('89504e470d0a1a0a');
		expect([png.readUInt32BE(16), png.readUInt32BE(20)]).toEqual([size, size]);
	}
	const apple = await (await request.get('/apple-touch-icon.png')).body();
	expect([apple.readUInt32BE(16), apple.readUInt32BE(20)]).toEqual([180, 180]);
});
