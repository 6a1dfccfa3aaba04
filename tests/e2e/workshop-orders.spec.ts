import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { expect, test, type Page } from '@playwright/test';
import { PDFDocument } from 'pdf-lib';
import { signInAs, signOut } from '../helpers/auth';
import { buyPersonalised } from '../helpers/buy';
import { parsedMail, waitForMail } from '../helpers/mail';

/**
 * The workshop's day with a genuinely paid order (bought through the shop and the payment
 * stand-in): carving, the production sheet, the packing slip, shipping with the buyer's e-mail,
 * and refunds. E-mails are read from the mail stand-in and parsed with mailparser.
 */
test.describe.configure({ timeout: 120_000 });

// ISO 216 A4 in PostScript points: 210 × 297 mm = 595.28 × 841.89 pt.
const A4 = { w: 595.28, h: 841.89 };

async function openOrder(page: Page, ref: string) {
	await page.goto('/workshop/orders');
	await page.getByRole('searchbox', { name: 'Search' }).fill(ref);
	// The search lands in the URL (the table's state), and the table shows just this order.
	await expect(page).toHaveURL(new RegExp(`[?&]q=${ref}`));
	await expect(page.locator('tr[data-ref]')).toHaveCount(1);
	await page.locator(`tr[data-ref="${ref}"]`).getByRole('link', { name: ref }).click();
	await expect(page.getByTestId('order-ref')).toHaveText(`Order ${ref}`);
}

test('owner carves, prints, and ships a paid personalised order; the buyer hears of it', async ({
	page
}) => {
	const email = `ship-${Date.now()}@example.test`;
	const { ref } = await buyPersonalised(page, 'RWK', email);

	await signInAs(page, 'owner');
	await openOrder(page, ref);
	const status = page.getByTestId('order-status').first();
	await expect(status).toHaveAttribute('data-status', 'paid');
	// Only the moves the status table allows from "paid" for a carved piece.
	const moves = page.getByRole('button', { name: /^Move to / });
	await expect(moves).toHaveText(['Move to Carving']);
	await page.getByRole('button', { name: 'Move to Carving' }).click();
	await expect(status).toHaveAttribute('data-status', 'carving');
	await expect(page.getByTestId('order-history')).toContainText('Paid → Carving');

	// The production sheet: the 1:1 template of the personalised line, on A4.
	const line = page.getByTestId('order-line').first();
	const [sheet] = await Promise.all([
		page.waitForEvent('download'),
		line.getByRole('link', { name: 'A4 PDF' }).click()
	]);
	const sheetBytes = readFileSync(await sheet.path());
	expect(sheetBytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
	const sheetPdf = await PDFDocument.load(sheetBytes);
	expect(sheetPdf.getPage(0).getWidth()).toBeCloseTo(A4.w, 2);
	expect(sheetPdf.getPage(0).getHeight()).toBeCloseTo(A4.h, 2);

	// The packing slip link; its PDF route lives beside this page once both halves are merged.
	const slip = page
		.getByRole('region', { name: 'Slips' })
		.getByRole('link', { name: 'A4' })
		.first();
	const slipHref = (await slip.getAttribute('href'))!;
	expect(slipHref).toBe(`/workshop/orders/${ref}/packing-slip.pdf?paper=a4`);
	const slipRoute = path.resolve('src/routes/workshop/orders/[ref]/packing-slip.pdf/+server.ts');
	if (existsSync(slipRoute)) {
		const res = await page.request.get(slipHref);
		expect(res.status()).toBe(200);
		const slipPdf = await PDFDocument.load(await res.body());
		expect(slipPdf.getPage(0).getWidth()).toBeCloseTo(A4.w, 2);
	}

	await page.getByRole('button', { name: 'Move to Finishing' }).click();
	await expect(status).toHaveAttribute('data-status', 'finishing');
	await page.getByRole('button', { name: 'Move to Packed' }).click();
	await expect(status).toHaveAttribute('data-status', 'packed');

	// A pasted control character is refused with a message and nothing changes.
	await page.getByLabel('Carrier').fill('USPS');
	await page.getByLabel('Tracking number').fill('9400 1118\t9922');
	await page.getByRole('button', { name: 'Mark shipped and e-mail the buyer' }).click();
	await expect(page.getByText(/control character/)).toBeVisible();
	await expect(status).toHaveAttribute('data-status', 'packed');

	await page.getByLabel('Tracking number').fill('9400 1118 9922 3344 5566 77');
	await page.getByRole('button', { name: 'Mark shipped and e-mail the buyer' }).click();
	await expect(status).toHaveAttribute('data-status', 'shipped');
	await expect(page.getByTestId('tracking')).toHaveText('9400111899223344556677');

	const caught = await waitForMail(email, /on its way/);
	const mail = await parsedMail(caught);
	expect(mail.subject).toBe(`Order ${ref} is on its way`);
	expect(mail.text).toContain('Tracking number: 9400111899223344556677');
	expect(mail.html).toContain('9400111899223344556677');
	// USPS publishes tracking at tools.usps.com/go/TrackConfirmAction?tLabels=<number>.
	expect(mail.text).toContain('TrackConfirmAction?tLabels=9400111899223344556677');
	const link = new URL(/https?:\/\/\S+\/orders\/\S+/.exec(mail.text as string)![0]);
	await signOut(page);
	await page.goto(link.pathname + link.search);
	await expect(page.getByText('9400111899223344556677')).toBeVisible();
});

test('partial then full refund, each e-mailed; a helper cannot refund', async ({ page }) => {
	const email = `refund-${Date.now()}@example.test`;
	const { ref, total } = await buyPersonalised(page, 'JB', email);

	await signInAs(page, 'owner');
	await openOrder(page, ref);
	const refund = page.getByRole('region', { name: 'Refund', exact: true });
	// More than was paid: a clear message, nothing refunded.
	await refund.getByLabel('Amount (USD)').fill('99999');
	await refund.getByLabel('Reason (the buyer reads this)').fill('Too much on purpose');
	await refund.getByRole('button', { name: 'Refund', exact: true }).click();
	await expect(page.getByText(/You can refund at most/)).toBeVisible();
	await expect(page.getByTestId('refunds')).toHaveCount(0);

	await refund.getByLabel('Amount (USD)').fill('10.00');
	await refund.getByLabel('Reason (the buyer reads this)').fill('A chip broke out at the rim');
	await refund.getByRole('button', { name: 'Refund', exact: true }).click();
	await expect(page.getByTestId('refunds')).toContainText('$10.00');
	await expect(page.getByTestId('order-status').first()).toHaveAttribute('data-status', 'paid');
	const part = await parsedMail(await waitForMail(email, /Refund of \$10\.00/));
	expect(part.text).toContain('We have refunded $10.00');
	expect(part.text).toContain('A chip broke out at the rim');

	// A helper sees no refund form, and the action itself answers 403.
	await signOut(page);
	await signInAs(page, 'helper');
	await openOrder(page, ref);
	await expect(page.getByRole('region', { name: 'Refund', exact: true })).toHaveCount(0);
	const res = await page.request.post(`/workshop/orders/${ref}?/refund`, {
		form: { kind: 'full', reason: 'helper tries' },
		headers: { origin: new URL(page.url()).origin }
	});
	expect(res.status()).toBe(403);

	await signOut(page);
	await signInAs(page, 'owner');
	await openOrder(page, ref);
	await refund.getByLabel('All that is left').check();
	await refund.getByLabel('Reason (the buyer reads this)').fill('Returned unused');
	await refund.getByRole('button', { name: 'Refund', exact: true }).click();
	await expect(page.getByTestId('order-status').first()).toHaveAttribute('data-status', 'refunded');
	await expect(page.getByTestId('refunded-total')).toContainText(`Refunded ${total} of ${total}`);
	const full = await parsedMail(await waitForMail(email, /Refund of/));
	// The newest refund mail: everything left after the $10.00.
	expect(full.text).toContain(`That is the whole ${total} you paid.`);
});
