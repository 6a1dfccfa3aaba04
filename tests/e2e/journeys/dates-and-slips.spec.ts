import { expect, test, type Page } from '@playwright/test';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { payWith, personaliseAndAdd } from '../../helpers/buy';
import { demoAccount, signInAs } from '../../helpers/auth';
import { waitForMail } from '../../helpers/mail';
import { pdfText } from '../../helpers/pdf-text';

/**
 * A buyer in Łódź personalises a bottle holder and pays; the ready-by day they are promised is
 * the same on the piece page, in the basket, at checkout, in the paid e-mail, in the owner's
 * alert and on their order page, and stays so when the owner moves the order on. The owner then
 * prints the packing slip and reads it back as printed (PDF.js): the Polish name, town and an
 * emoji gift note come out letter for letter. Several slips print on US Letter.
 */
test.describe.configure({ timeout: 120_000 });

const MONTHS = 'Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec';
/** "Fri, Dec 11", "Friday, December 11, 2026" → "Dec 11": the calendar day any format names. */
function monthDay(words: string): string {
	const m = new RegExp(`(${MONTHS})[a-z]*\\.? (\\d{1,2})\\b`).exec(words);
	expect(m, `a date in "${words}"`).not.toBeNull();
	return `${m![1]} ${m![2]}`;
}

const text = async (page: Page, id: string) => (await page.getByTestId(id).textContent())!.trim();

test('one ready-by day everywhere, and a Polish packing slip that prints right', async ({
	page,
	browser
}) => {
	const email = `lodz-${Date.now()}@example.test`;
	const note = 'Wszystkiego najlepszego! 🎂';

	// Piece page: the personaliser dates the layout from the carving queue.
	await personaliseAndAdd(page, 'LW');
	const onPiece = monthDay(await text(page, 'personaliser-ready'));

	// Basket, posting to Poland: the line and the whole order give the same day.
	await page.getByTestId('cart-link').click();
	await expect(page.getByTestId('line-initials')).toHaveText('LW');
	await page.getByTestId('country').selectOption('PL');
	await expect(page.getByTestId('country')).toHaveValue('PL');
	await page.waitForLoadState('networkidle');
	expect(monthDay(await text(page, 'line-ready-by'))).toBe(onPiece);
	expect(monthDay(await text(page, 'order-ready-by'))).toBe(onPiece);

	// Checkout with a Polish name, street and town.
	await page.getByTestId('to-checkout').click();
	await expect(page).toHaveURL(/\/checkout$/);
	expect(monthDay(await text(page, 'checkout-ready-by'))).toBe(onPiece);
	await page.getByLabel('Name', { exact: true }).fill('Łukasz Wiśniewski');
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Street address').fill('ul. Piotrkowska 12');
	await page.getByLabel('Town or city').fill('Łódź');
	await page.getByLabel('Postcode or ZIP').fill('90-001');
	await page.getByLabel('Gift note (optional)').fill(note);
	await page.getByTestId('pay').click();
	await expect(page.getByRole('heading', { name: 'Pay by card' })).toBeVisible();
	await payWith(page, '4242 4242 4242 4242');
	await expect(page.getByTestId('order-paid')).toBeVisible({ timeout: 15_000 });
	const ref = (await page.getByTestId('order-ref').textContent())!.trim();

	// The paid e-mail and the owner's alert name the same day.
	const paidMail = await waitForMail(email, new RegExp(ref));
	const promised = /Ready to post by ([^.]+)\./.exec(paidMail.text)?.[1] ?? '';
	expect(monthDay(promised)).toBe(onPiece);
	const alert = await waitForMail(demoAccount('owner').email, new RegExp(`New order ${ref}`));
	expect(alert.text).toContain(`ready to post by ${promised}`);

	// The buyer's order page, opened from the e-mail's link.
	const link = new URL(/https?:\/\/\S+\/orders\/\S+/.exec(paidMail.text)![0]);
	await page.goto(link.pathname + link.search);
	await expect(page.getByTestId('order-ready-by')).toHaveText(promised);

	// The owner, in a browser of their own, moves the order onto the bench.
	const owner = await (await browser.newContext()).newPage();
	await signInAs(owner, 'owner');
	await owner.goto(`/workshop/orders/${ref}`);
	await expect(owner.getByTestId('promised-by')).toBeVisible();
	expect(monthDay(await text(owner, 'promised-by'))).toBe(onPiece);
	await owner.getByRole('button', { name: 'Move to Carving' }).click();
	await expect(owner.getByRole('button', { name: 'Move to Finishing' })).toBeVisible();
	// The buyer reloads: the promise has not moved with the queue.
	await page.reload();
	await expect(page.getByTestId('order-ready-by')).toHaveText(promised);

	// The packing slip as printed: every letter of the Polish address and the emoji note.
	const slip = await owner.request.get(`/workshop/orders/${ref}/packing-slip.pdf?paper=a4`);
	expect(slip.status()).toBe(200);
	const printed = await pdfText(await slip.body());
	expect(printed).toContain('Łukasz Wiśniewski');
	expect(printed).toContain('Łódź');
	expect(printed).toContain('ul. Piotrkowska 12');
	expect(printed).toContain(note);
	expect(printed).toContain(`ready to post by ${promised}`);
	expect(printed).not.toContain('?');
	await expect(owner.getByTestId('unprintable')).toHaveCount(0);

	// Several slips at once, on US Letter (8.5 × 11 in = 612 × 792 pt at 72 pt per inch).
	await owner.goto('/workshop/orders');
	await owner.getByRole('searchbox', { name: 'Search' }).fill(email);
	await expect(owner.locator('tr[data-ref]')).toHaveCount(1);
	await owner.getByRole('checkbox', { name: `Select ${ref}` }).check();
	const letter = owner.getByTestId('bulk-bar').getByRole('link', { name: 'Letter' });
	const href = await letter.getAttribute('href');
	expect(href).toContain('paper=letter');
	const batch = await owner.request.get(href!);
	expect(batch.status()).toBe(200);
	const bytes = await batch.body();
	const doc = await getDocument({ data: new Uint8Array(bytes) }).promise;
	const [x0, y0, x1, y1] = (await doc.getPage(1)).view;
	expect(x1 - x0).toBeCloseTo(612, 1);
	expect(y1 - y0).toBeCloseTo(792, 1);
	await doc.destroy();
	expect(await pdfText(bytes)).toContain('Łukasz Wiśniewski');
});

test('on a phone, the piece page and the basket give the same ready-by day', async ({
	browser
}) => {
	const phone = await browser.newContext({ viewport: { width: 390, height: 844 } });
	const page = await phone.newPage();
	await personaliseAndAdd(page, 'AK');
	const onPiece = monthDay(await text(page, 'personaliser-ready'));
	await page.getByTestId('cart-link').click();
	await expect(page.getByTestId('line-initials')).toHaveText('AK');
	expect(monthDay(await text(page, 'line-ready-by'))).toBe(onPiece);
	expect(monthDay(await text(page, 'order-ready-by'))).toBe(onPiece);
	// Reloading the basket dates it the same way again.
	await page.reload();
	expect(monthDay(await text(page, 'order-ready-by'))).toBe(onPiece);
	await phone.close();
});
