import { expect, test } from '@playwright/test';
import { declinedAndBack, fillCheckout, payWith, personaliseAndAdd } from '../helpers/buy';
import { signInAs } from '../helpers/auth';
import { waitForMail } from '../helpers/mail';

/**
 * The buyer's journey end to end against the built app and the stand-ins: personalise, basket,
 * checkout, pay on the stand-in payment page with Stripe's published test cards, confirmation
 * e-mail, and the order in the workshop. Test cards from Stripe's testing docs: 4242 4242 4242
 * 4242 succeeds, 4000 0000 0000 0002 is declined (generic decline).
 */

// Each test walks the whole journey, two sites and a sign-in: more than the default budget.
test.describe.configure({ timeout: 90_000 });

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
	await expect(page.getByTestId('order-status')).toHaveAttribute('data-status', 'paid');
	await expect(page.getByTestId('order-status')).toContainText('Paid');
	// Without the signature the same page is not shown.
	const bare = await page.goto(`/orders/${ref}`);
	expect(bare?.status()).toBe(404);

	await signInAs(page, 'owner');
	await page.goto('/workshop/orders');
	const row = page.locator(`tr[data-ref="${ref}"]`);
	await expect(row).toContainText('Marigold Fenn');
	await expect(row.getByTestId('order-status')).toHaveAttribute('data-status', 'paid');
	await expect(row).toContainText(total);
});

test('a declined card brings the buyer back to the basket with nothing paid', async ({ page }) => {
	const email = `declined-${Date.now()}@example.test`;
	await declinedAndBack(page, 'QZ', email);
	const notice = page.getByTestId('payment-not-completed');
	await expect(notice).toContainText('Your card was declined');
	await expect(notice).toContainText('Nothing was charged');
	// The basket is as it was.
	await expect(page.getByTestId('line-initials')).toHaveText('QZ');

	await signInAs(page, 'owner');
	// An unpaid checkout is kept out of the orders that need doing, under a view of its own.
	await page.goto('/workshop/orders');
	await page.getByRole('searchbox', { name: 'Search' }).fill(email);
	await expect(page.getByText('No orders match these filters.')).toBeVisible();
	await page.getByRole('link', { name: 'Unpaid checkouts' }).click();
	await expect(page).toHaveURL(/view=abandoned/);
	await page.getByRole('searchbox', { name: 'Search' }).fill(email);
	await expect(page.locator('tr[data-ref]')).toHaveCount(1);
	const row = page.locator('tr', { hasText: email });
	await expect(row.getByTestId('order-status')).toHaveAttribute('data-status', 'cancelled');
	// No confirmation e-mail for an unpaid order.
	const res = await fetch(
		process.env.MAIL_INBOX_URL ||
			`http://127.0.0.1:${process.env.MAIL_INBOX_PORT || 8025}/api/messages`
	);
	const list = (await res.json()) as { to: string[] }[];
	expect(list.some((m) => m.to.includes(email))).toBe(false);
});
