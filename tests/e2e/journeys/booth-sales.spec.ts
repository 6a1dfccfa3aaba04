import { expect, test, type Page } from '@playwright/test';
import { demoAccount, signInAs } from '../../helpers/auth';
import { waitForMail } from '../../helpers/mail';

/**
 * A fair day on a 390×844 phone, hands quick and signal coming and going: a double tap makes one
 * sale; a sale voided without signal leaves the takings once sent; a booth order with a deposit
 * reads as deposit-taken with its balance in the workshop and in both e-mails; a sale made
 * offline, then the fair closed by the owner, then signal back: the sale counts, marked late, and
 * the phone has nothing waiting.
 */
test.use({ viewport: { width: 390, height: 844 }, hasTouch: true });

const ORNAMENT = /Add Rosette ornament, Basswood/;

async function waitingIs(page: Page, n: number) {
	await expect(page.getByTestId('waiting')).toHaveText(`${n} waiting`, { timeout: 20_000 });
}

test('a fair day on a phone: one tap one sale, a void offline, a deposit order, a late sale', async ({
	page
}) => {
	test.setTimeout(180_000);
	await signInAs(page, 'owner');
	const name = `Booth Day Fair ${Date.now() % 100000}`;
	const today = new Date().toISOString().slice(0, 10);
	await page.goto('/workshop/fairs');
	await page.getByLabel('Name').fill(name);
	await page.getByLabel('Place').fill('Hall of Łódź, Zürich');
	await page.getByLabel('First day').fill(today);
	await page.getByLabel('Last day').fill(today);
	await page.getByLabel('Sales-tax rate (%)').fill('7.25');
	await page.getByLabel('Cash float').fill('100');
	await page.getByRole('button', { name: 'Add the fair' }).click();
	await expect(page).toHaveURL(/\/workshop\/fairs\/\d+$/);
	const fairUrl = new URL(page.url()).pathname;
	// Two, so the journey does not depend on what other tests left on the workshop shelf.
	await page.getByLabel('Take Rosette ornament, Basswood').fill('2');
	await page.getByRole('button', { name: 'Load out' }).click();
	await expect(page.getByRole('status')).toContainText('Loaded out 2 pieces');

	// A double tap on "Record the sale" makes one sale.
	await page.goto(`${fairUrl}/booth`);
	await expect(page.getByTestId('tile-stock').first()).toHaveText('2 left');
	await page.getByRole('button', { name: ORNAMENT }).click();
	const record = page.getByRole('button', { name: 'Record the sale' });
	// The total and the button stay on screen while choosing.
	await expect(record).toBeInViewport();
	const box = await record.boundingBox();
	expect(box!.height).toBeGreaterThanOrEqual(44); // WCAG 2.5.5: targets at least 44 × 44 px.
	await record.dblclick();
	await waitingIs(page, 0);
	await expect(page.getByTestId('day-sale')).toHaveCount(1);
	await page.reload();
	await expect(page.getByTestId('day-sale')).toHaveCount(1);
	await expect(page.getByTestId('day-cash')).toContainText('1 sale');

	// The sale voided without signal, then sent: the takings drop back to nothing.
	await page.context().setOffline(true);
	await expect(page.getByTestId('net-status')).toHaveText('Offline');
	await page.getByRole('button', { name: /^Void the sale/ }).click();
	await page.getByLabel('Why is it voided?').fill('Tapped twice by mistake');
	await page.getByRole('button', { name: 'Void this sale' }).click();
	await waitingIs(page, 1);
	await page.context().setOffline(false);
	await waitingIs(page, 0);
	await page.goto(`${fairUrl}/report`);
	await expect(page.getByText('Takings $0.00')).toBeVisible();
	await expect(page.getByTestId('voided-sales')).toContainText('Tapped twice by mistake');

	// A booth order with a deposit: deposit taken, balance due, in the workshop and both e-mails.
	await page.goto(`${fairUrl}/booth`);
	await page.getByText('Take a personalised order').click();
	const buyer = `booth-${Date.now() % 100000}@example.test`;
	await page.getByLabel('Initials').fill('ZL');
	await page.getByLabel("Buyer's name").fill('Zofia Łęcka');
	await page.getByLabel('E-mail', { exact: true }).fill(buyer);
	await page.getByText('Buyer collects').click();
	await expect(page.getByTestId('order-total')).toBeVisible();
	await page.getByLabel('Deposit taken').fill('10');
	await page.getByRole('button', { name: 'Keep the order' }).dblclick();
	await waitingIs(page, 0);
	const mail = await waitForMail(buyer, /Order/);
	const ref = /Order (\S+):/.exec(mail.subject)![1];
	expect(mail.text).toContain('Deposit paid: $10.00');
	expect(mail.text).toMatch(/Left to pay before it ships: \$\d+\.\d\d/);
	const alert = await waitForMail(demoAccount('owner').email, new RegExp(`New order ${ref}`));
	expect(alert.text).toContain('Deposit taken: $10.00');
	expect(alert.text).toMatch(/balance due: \$\d+\.\d\d/);
	await page.goto(`/workshop/orders/${ref}`);
	await expect(page.getByTestId('order-status').first()).toHaveText('Deposit taken, balance due');

	// A sale made offline; the owner closes the fair; signal back: counted, late, nothing waiting.
	await page.goto(`${fairUrl}/booth`);
	await page.context().setOffline(true);
	await expect(page.getByTestId('net-status')).toHaveText('Offline');
	await page.getByRole('button', { name: ORNAMENT }).click();
	await page.getByRole('button', { name: 'Record the sale' }).click();
	await waitingIs(page, 1);
	const desk = await page.context().browser()!.newContext();
	const owner = await desk.newPage();
	await signInAs(owner, 'owner');
	const closed = await owner.request.post(`${fairUrl}/tally?/close`, {
		headers: { origin: new URL(owner.url()).origin, 'x-sveltekit-action': 'true' },
		// The owner has said yes to "Close the fair?" (the tally asks before closing).
		form: { confirm: 'yes' }
	});
	expect(closed.status()).toBeLessThan(400);
	await page.context().setOffline(false);
	await waitingIs(page, 0);
	await expect(page.getByTestId('refused')).toHaveCount(0);
	await owner.goto(`${fairUrl}/report`);
	await expect(owner.getByTestId('late-sales')).toContainText('1 sale arrived after the close');
	await expect(owner.getByText(/^Takings \$/)).toBeVisible();
	await expect(owner.getByText('Takings $0.00')).toHaveCount(0);
	await desk.close();
});
