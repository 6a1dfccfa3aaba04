import { expect, test, type Page } from '@playwright/test';
import { declinedAndBack, fillCheckout, payWith, personaliseAndAdd } from '../helpers/buy';

/**
 * Coming back from the payment page unpaid finds the checkout form as the buyer left it, kept
 * on the server against their basket (never in the address), so they only try another card.
 * Test cards from Stripe's testing docs: 4242 4242 4242 4242 succeeds, 4000 0000 0000 0002 is
 * declined (generic decline). The values typed are fillCheckout's.
 */
test.describe.configure({ timeout: 90_000 });

/** Every field fillCheckout typed is back, as typed (the state in capitals, as stored). */
async function expectFormFilled(page: Page, email: string) {
	await expect(page).toHaveURL(/\/checkout$/);
	await expect(page.getByLabel('Name', { exact: true })).toHaveValue('Marigold Fenn');
	await expect(page.getByLabel('E-mail')).toHaveValue(email);
	await expect(page.getByLabel('Street address')).toHaveValue('14 Alder Row');
	await expect(page.getByLabel('Town or city')).toHaveValue('Boulder');
	await expect(page.getByLabel('State or region')).toHaveValue('CO');
	await expect(page.getByLabel('Postcode or ZIP')).toHaveValue('80302');
	await expect(page.getByLabel('Country')).toHaveValue('US');
	await expect(page.getByLabel('Gift note (optional)')).toHaveValue('Happy new home!');
}

test('a declined card keeping the address: back at checkout the form is filled, and a good card pays', async ({
	page
}) => {
	const email = `kept-${Date.now()}@example.test`;
	await declinedAndBack(page, 'KA', email);
	// Nothing personal travels in the address the payment page sends the buyer back to.
	expect(page.url()).not.toContain(encodeURIComponent(email));
	expect(page.url()).not.toContain('Alder');

	await page.getByTestId('to-checkout').click();
	await expectFormFilled(page, email);

	// Only the card changes: send the kept form as it is and pay with the good card.
	await page.getByTestId('pay').click();
	await expect(page.getByRole('heading', { name: 'Pay by card' })).toBeVisible();
	await expect(page.getByText(`Receipt to ${email}`)).toBeVisible();
	await payWith(page, '4242 4242 4242 4242');
	await expect(page.getByTestId('order-paid')).toBeVisible({ timeout: 15_000 });

	// Paid: the basket's copy of the details is gone (they live on in the order only).
	await personaliseAndAdd(page, 'KB');
	await page.getByTestId('cart-link').click();
	await page.getByTestId('to-checkout').click();
	await expect(page).toHaveURL(/\/checkout$/);
	await expect(page.getByLabel('E-mail')).toHaveValue('');
	await expect(page.getByLabel('Street address')).toHaveValue('');
});

test('cancel and go back from the payment page keeps the form filled', async ({ page }) => {
	const email = `cancelled-${Date.now()}@example.test`;
	await personaliseAndAdd(page, 'KC');
	await page.getByTestId('cart-link').click();
	await fillCheckout(page, email);

	await page.getByRole('link', { name: 'Cancel and go back' }).click();
	await expect(page).toHaveURL(/\/cart\?cancelled=1/);
	await page.getByTestId('to-checkout').click();
	await expectFormFilled(page, email);

	// Another visitor (no basket cookie of this one) sees none of it.
	const other = await page.context().browser()!.newContext();
	const stranger = await other.newPage();
	await personaliseAndAdd(stranger, 'KD');
	await stranger.getByTestId('cart-link').click();
	await stranger.getByTestId('to-checkout').click();
	await expect(stranger.getByLabel('E-mail')).toHaveValue('');
	await expect(stranger.getByLabel('Street address')).toHaveValue('');
	await other.close();
});
