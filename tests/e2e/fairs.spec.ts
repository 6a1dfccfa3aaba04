import { expect, test, type Page } from '@playwright/test';
import { demoAccount, signInAs } from '../helpers/auth';

/**
 * The fair from start to finish on a phone: create, load out, sell with the network off (after a
 * reload), reconnect, tally with one piece missing and 5.00 short, and read the report. Then what
 * a helper may and may not see.
 */
test.use({ viewport: { width: 390, height: 844 }, hasTouch: true });

const SALES_POST = /\/api\/booth\/\d+\/sales$/;

async function addPiece(page: Page, name: RegExp, times = 1) {
	for (let i = 0; i < times; i++) await page.getByRole('button', { name }).click();
}

async function recordSale(page: Page, expectedWaiting: number) {
	await page.getByRole('button', { name: 'Record the sale' }).click();
	await expect(page.getByTestId('waiting')).toHaveText(`${expectedWaiting} waiting`);
}

/**
 * Opens the booth online and waits until it can work without signal. The first visit installs
 * the service worker; a reload online makes sure it controls the page (as a phone would on its
 * next visit). Then the network goes off and the page is reloaded from the worker's copy.
 */
async function goOfflineAndReload(page: Page, url: string) {
	await page.goto(url);
	await expect(page.getByTestId('offline-ready')).toBeVisible({ timeout: 20_000 });
	await page.reload();
	await expect(page.getByTestId('offline-ready')).toBeVisible({ timeout: 20_000 });
	await page.waitForFunction(() => navigator.serviceWorker.controller !== null, null, {
		timeout: 20_000
	});
	await page.context().setOffline(true);
	await page.reload();
	await expect(page.getByTestId('net-status')).toHaveText('Offline');
}

test('a fair on a phone: offline sales, tally, report, and what a helper sees', async ({
	page,
	browser
}) => {
	test.setTimeout(120_000);
	await signInAs(page, 'owner');
	const name = `Test Meadow Fair ${Date.now() % 100000}`;
	const today = new Date().toISOString().slice(0, 10);

	await page.goto('/workshop/fairs');
	await page.getByLabel('Name').fill(name);
	await page.getByLabel('Place').fill('Meadow Hall, Linden Ford');
	await page.getByLabel('First day').fill(today);
	await page.getByLabel('Last day').fill(today);
	await page.getByLabel('Booth fee').fill('50.00');
	await page.getByLabel('Other costs').fill('10');
	await page.getByLabel('Sales-tax rate (%)').fill('7.25');
	await page.getByLabel('Cash float').fill('100');
	await page.getByLabel('Card reader fee (%)').fill('2.6');
	await page.getByLabel('Hours open in all').fill('6');
	await page.getByRole('button', { name: 'Add the fair' }).click();
	await expect(page).toHaveURL(/\/workshop\/fairs\/\d+$/);
	const fairUrl = new URL(page.url()).pathname;

	await page.getByLabel('Take Rosette ornament, Basswood').fill('5');
	await page.getByLabel('Take Trinket box, Basswood').fill('2');
	await page.getByRole('button', { name: 'Load out' }).click();
	await expect(page.getByRole('status')).toContainText('Loaded out 7 pieces');
	const pdf = await page.request.get(`${fairUrl}/checklist.pdf?paper=letter`);
	expect(pdf.headers()['content-type']).toBe('application/pdf');
	expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-');

	await goOfflineAndReload(page, `${fairUrl}/booth`);
	// Six pieces in five sales: cash with change, card, a discount, other.
	await addPiece(page, /Add Rosette ornament, Basswood/, 2);
	await page.getByLabel('Cash handed over').fill('50');
	await expect(page.getByTestId('change')).toBeVisible();
	await recordSale(page, 1);
	await expect(page.getByRole('status')).toContainText('change due');
	await addPiece(page, /Add Trinket box, Basswood/);
	await page.getByRole('button', { name: 'card', exact: true }).click();
	await recordSale(page, 2);
	await addPiece(page, /Add Rosette ornament, Basswood/);
	await page.getByLabel(/^Discount/).fill('1.00');
	await recordSale(page, 3);
	await addPiece(page, /Add Trinket box, Basswood/);
	await page.getByRole('button', { name: 'other', exact: true }).click();
	await recordSale(page, 4);
	await addPiece(page, /Add Rosette ornament, Basswood/);
	await page.getByRole('button', { name: 'card', exact: true }).click();
	await recordSale(page, 5);

	const sent = page.waitForResponse((r) => SALES_POST.test(r.url()) && r.ok());
	await page.context().setOffline(false);
	await sent;
	await expect(page.getByTestId('net-status')).toHaveText('Online');
	await expect(page.getByTestId('waiting')).toHaveText('0 waiting', { timeout: 15_000 });

	await page.goto(`${fairUrl}/tally`);
	await page.getByLabel('Counted Rosette ornament · Basswood').fill('0');
	await page.getByLabel('Counted Trinket box · Basswood').fill('0');
	await page.getByRole('button', { name: 'Save the counts' }).click();
	await expect(page.getByRole('status')).toContainText('Counts saved');
	const expectedText = await page
		.locator('dt', { hasText: 'Cash expected' })
		.locator('+ dd')
		.innerText();
	const expectedCents = Math.round(Number(expectedText.replace(/[^0-9.]/g, '')) * 100);
	await page.getByLabel('Cash counted in the tin').fill(((expectedCents - 500) / 100).toFixed(2));
	await page.getByRole('button', { name: 'Save the counts' }).click();
	await expect(page.getByTestId('cash-difference')).toContainText('$5.00 short');
	await expect(page.getByTestId('tally-row').filter({ hasText: 'Rosette ornament' })).toContainText(
		'-1 (missing)'
	);

	await page.goto(`${fairUrl}/report`);
	await expect(page.getByTestId('report-problems')).toContainText('Cash $5.00 short');
	await expect(page.getByTestId('report-problems')).toContainText('1 missing');
	await expect(page.getByTestId('chart-method')).toBeVisible();
	const csv = await page.request.get(`${fairUrl}/report.csv`);
	expect(csv.headers()['content-type']).toContain('text/csv');

	await page.goto('/workshop/fairs');
	await expect(
		page.getByRole('listitem').filter({ hasText: name }).getByTestId('fair-net')
	).toContainText('Net');

	// A helper counts and sells but never sees the net, the fees or the report.
	const helperContext = await browser.newContext({ viewport: { width: 390, height: 844 } });
	const helper = await helperContext.newPage();
	await signInAs(helper, 'helper');
	// Fairs have their helpers: refused until the owner names this helper for the fair.
	expect((await helper.goto(`${fairUrl}/tally`))?.status()).toBe(403);
	await page.goto(fairUrl);
	await page.getByLabel(new RegExp(demoAccount('helper').name)).check();
	await page.getByRole('button', { name: 'Save who sells' }).click();
	await expect(page.getByRole('status')).toContainText('1 helper sells here');
	await helper.goto(`${fairUrl}/tally`);
	await expect(helper.getByRole('heading', { name: 'Tally' })).toBeVisible();
	await expect(helper.getByText('Net for the fair')).toHaveCount(0);
	await expect(helper.getByText('Booth fee')).toHaveCount(0);
	await helper.goto('/workshop/fairs');
	await expect(helper.getByTestId('fair-net')).toHaveCount(0);
	const report = await helper.goto(`${fairUrl}/report`);
	expect(report?.status()).toBe(403);
	await helperContext.close();
});

test('twenty sales made offline are stored once, however often they are sent', async ({ page }) => {
	test.setTimeout(120_000);
	await signInAs(page, 'owner');
	await page.goto('/workshop/fairs');
	await page.getByRole('link', { name: 'Riverbank Winter Market' }).click();
	await expect(page).toHaveURL(/\/workshop\/fairs\/\d+$/);
	const fairUrl = new URL(page.url()).pathname;
	const bodies: string[] = [];
	page.on('request', (r) => {
		if (r.method() === 'POST' && SALES_POST.test(r.url())) bodies.push(r.postData() ?? '');
	});
	const cashCount = async () =>
		Number(/(\d+) sales?/.exec((await page.getByTestId('day-cash').textContent()) ?? '')?.[1]);
	await page.goto(`${fairUrl}/booth`);
	const before = await cashCount();
	await goOfflineAndReload(page, `${fairUrl}/booth`);
	for (let i = 1; i <= 20; i++) {
		await addPiece(page, /Add Rosette ornament, Basswood/);
		await recordSale(page, i);
	}
	const answers: { accepted: string[]; duplicate: string[] }[] = [];
	page.on('response', async (r) => {
		if (SALES_POST.test(r.url()) && r.ok())
			answers.push((await r.json()) as (typeof answers)[number]);
	});
	await page.context().setOffline(false);
	await expect(page.getByTestId('waiting')).toHaveText('0 waiting', { timeout: 20_000 });
	await expect.poll(() => answers.reduce((a, x) => a + x.accepted.length, 0)).toBe(20);
	const ids = new Set(answers.flatMap((a) => a.accepted));
	expect(ids.size).toBe(20);

	// The same batches again, once and then five times at once: nothing new is stored.
	const fairId = fairUrl.split('/').pop();
	const send = (body: string) =>
		page.request.post(`/api/booth/${fairId}/sales`, {
			data: body,
			headers: { 'content-type': 'application/json' }
		});
	expect(bodies.length).toBeGreaterThan(0);
	for (const body of bodies.filter((b) => b.includes('"sales"'))) {
		const once = (await (await send(body)).json()) as { accepted: string[] };
		expect(once.accepted).toEqual([]);
		const five = await Promise.all(Array.from({ length: 5 }, () => send(body)));
		for (const r of five) expect(((await r.json()) as { accepted: string[] }).accepted).toEqual([]);
	}
	await page.goto('/fairs');
	await expect(
		page.getByRole('listitem').filter({ hasText: 'Riverbank Winter Market' })
	).toContainText('Old Granary, Linden Ford');
	await page.goto('/');
	await expect(page.getByTestId('next-fair')).toBeVisible();
	await page.goto(`${fairUrl}/booth`);
	expect(await cashCount()).toBe(before + 20);
});
