import { expect, test, type Page } from '@playwright/test';
import { signInAs } from './helpers/auth';
import { waitForMail } from './helpers/mail';

/**
 * The buyer's journey end to end against the built app and the stand-ins: personalise, basket,
 * checkout, pay on the stand-in payment page with Stripe's published test cards, confirmation
 * e-mail, and the order in the workshop. Test cards from Stripe's testing docs: 4242 4242 4242
 * 4242 succeeds, 4000 0000 0000 0002 is declined (generic decline).
 */

const PIECE = '/shop/rosette-bottle-holder';

// Each test walks the whole journey, two sites and a sign-in: more than the default budget.
test.describe.configure({ timeout: 90_000 });

async function personaliseAndAdd(page: Page, initials: string) {
	await page.goto(PIECE, { waitUntil: 'networkidle' });
	const preview = page.getByTestId('personaliser-preview');
	const section = page.getByRole('region', { name: 'Carved with your initials' });
	await section.getByRole('textbox', { name: 'Initials' }).fill(initials);
	// The live preview redraws with the typed initials inside the rosette (named in its title).
	await expect(preview.locator('svg > title').first()).toContainText(`initials ${initials}`);
	await section.getByText('Black cherry').click();
	await expect(preview.locator('svg > title').first()).toContainText('black cherry');
	await page.getByRole('button', { name: 'Add to basket with these initials' }).click();
	await expect(page.getByTestId('added-notice')).toBeVisible();
	await expect(page.getByTestId('cart-count')).toHaveText('1');
}

async function fillCheckout(page: Page, email: string) {
	await page.getByTestId('to-checkout').click();
	await expect(page).toHaveURL(/\/checkout$/);
	await page.getByLabel('Name', { exact: true }).fill('Marigold Fenn');
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Street address').fill('14 Alder Row');
	await page.getByLabel('Town or city').fill('Boulder');
	await page.getByLabel('State or region').fill('CO');
	await page.getByLabel('Postcode or ZIP').fill('80302');
	await page.getByLabel('Gift note (optional)').fill('Happy new home!');
	const total = (await page.getByTestId('checkout-total').textContent())!.trim();
	await page.getByTestId('pay').click();
	await expect(page.getByRole('heading', { name: 'Pay by card' })).toBeVisible();
	return total;
}

async function payWith(page: Page, card: string) {
	await page.getByLabel('Card number').fill(card);
	await page.getByLabel('Expiry (MM/YY)').fill('12/34');
	await page.getByLabel('Security code').fill('123');
	await page.getByLabel('Name on card').fill('Marigold Fenn');
	await page.getByRole('button', { name: /^Pay / }).click();
}

test('personalise, pay with the test card, e-mail and workshop see it paid', async ({ page }) => {
	const email = `buyer-${Date.now()}@example.test`;
	await personaliseAndAdd(page, 'MJF');

	await page.getByTestId('cart-link').click();
	await expect(page.getByTestId('line-initials')).toHaveText('MJF');
	// The basket's preview is the server's own drawing of the stored snapshot.
	await expect(page.getByTestId('cart-line').locator('svg')).toBeVisible();

	const total = await fillCheckout(page, email);
	// The stand-in's page shows the amount the server computed.
	await expect(page.getByRole('button', { name: `Pay ${total}` })).toBeVisible();
	await payWith(page, '4242 4242 4242 4242');

	await expect(page).toHaveURL(/\/checkout\/done\?session_id=/);
	await expect(page.getByTestId('order-paid')).toBeVisible({ timeout: 15_000 });
	const ref = (await page.getByTestId('order-ref').textContent())!.trim();
	await expect(page.getByTestId('done-total')).toHaveText(total);
	await expect(page.getByTestId('cart-count')).toHaveText('0');

	const mail = await waitForMail(email, new RegExp(ref));
	expect(mail.text).toContain(`Total paid: ${total}`);
	expect(mail.text).toContain('Initials MJF');
	expect(mail.text).toContain('Black cherry');
	expect(mail.html).toContain('<strong>MJF</strong>');
	// The e-mail's signed link opens the buyer's order page without signing in.
	const link = /https?:\/\/\S+\/orders\/\S+/.exec(mail.text)![0];
	await page.goto(new URL(link).pathname + new URL(link).search);
	await expect(page.getByTestId('order-status')).toContainText('paid');
	// Without the signature the same page is not shown.
	const bare = await page.goto(`/orders/${ref}`);
	expect(bare?.status()).toBe(404);

	await signInAs(page, 'owner');
	await page.goto('/workshop/orders');
	const row = page.locator(`tr[data-ref="${ref}"]`);
	await expect(row).toContainText('Marigold Fenn');
	await expect(row.getByTestId('order-status')).toHaveText('paid');
	await expect(row).toContainText(total);
});

test('a declined card brings the buyer back to the basket with nothing paid', async ({ page }) => {
	const email = `declined-${Date.now()}@example.test`;
	await personaliseAndAdd(page, 'QZ');
	await page.getByTestId('cart-link').click();
	await fillCheckout(page, email);

	await payWith(page, '4000 0000 0000 0002');
	await expect(page.getByRole('alert')).toContainText(/declined/i);
	await page.getByRole('link', { name: 'Cancel and go back' }).click();

	await expect(page).toHaveURL(/\/cart\?cancelled=1/);
	const notice = page.getByTestId('payment-not-completed');
	await expect(notice).toContainText('Your card was declined');
	await expect(notice).toContainText('Nothing was charged');
	// The basket is as it was.
	await expect(page.getByTestId('line-initials')).toHaveText('QZ');

	await signInAs(page, 'owner');
	await page.goto('/workshop/orders');
	await page.getByLabel('Show unfinished and cancelled checkouts').check();
	const row = page.locator('tr', { hasText: email });
	await expect(row.getByTestId('order-status')).toHaveText('cancelled');
	// No confirmation e-mail for an unpaid order.
	const res = await fetch(
		process.env.MAIL_INBOX_URL ||
			`http://127.0.0.1:${process.env.MAIL_INBOX_PORT || 8025}/api/messages`
	);
	const list = (await res.json()) as { to: string[] }[];
	expect(list.some((m) => m.to.includes(email))).toBe(false);
});
