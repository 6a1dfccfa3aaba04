import { expect, type Page } from '@playwright/test';

/**
 * The buyer's way to a paid order through the real shop and the payment stand-in, shared by the
 * checkout tests and the workshop tests that need a genuinely paid order (one the payment server
 * can refund). Test cards from Stripe's testing docs: 4242 4242 4242 4242 succeeds.
 */
const PIECE = '/shop/rosette-bottle-holder';

export async function personaliseAndAdd(page: Page, initials: string) {
	await page.goto(PIECE, { waitUntil: 'networkidle' });
	const preview = page.getByTestId('personaliser-preview');
	const section = page.getByRole('region', { name: 'Carved with your initials' });
	await section.getByRole('textbox', { name: 'Initials' }).fill(initials);
	// The live preview redraws with the typed initials inside the rosette (named in its title).
	await expect(preview.locator('svg > title').first()).toContainText(`initials ${initials}`);
	// The wood's own choice (a refusal of small letters may also offer a wood by name).
	await section.locator('label', { hasText: 'Black cherry' }).click();
	await expect(preview.locator('svg > title').first()).toContainText('black cherry');
	await page.getByRole('button', { name: 'Add to basket with these initials' }).click();
	await expect(page.getByTestId('added-notice')).toBeVisible();
	await expect(page.getByTestId('cart-count')).toHaveText('1');
}

export async function fillCheckout(page: Page, email: string) {
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

export async function payWith(page: Page, card: string) {
	await page.getByLabel('Card number').fill(card);
	await page.getByLabel('Expiry (MM/YY)').fill('12/34');
	await page.getByLabel('Security code').fill('123');
	await page.getByLabel('Name on card').fill('Marigold Fenn');
	await page.getByRole('button', { name: /^Pay / }).click();
}

/**
 * Personalises, checks out, is declined (4000 0000 0000 0002, Stripe's generic decline) and
 * follows "Cancel and go back" to the basket.
 */
export async function declinedAndBack(page: Page, initials: string, email: string) {
	await personaliseAndAdd(page, initials);
	await page.getByTestId('cart-link').click();
	await fillCheckout(page, email);
	await payWith(page, '4000 0000 0000 0002');
	await expect(page.getByRole('alert')).toContainText(/declined/i);
	await page.getByRole('link', { name: 'Cancel and go back' }).click();
	await expect(page).toHaveURL(/\/cart\?cancelled=1/);
}

/** Personalises, checks out and pays; returns the order reference and the total shown. */
export async function buyPersonalised(page: Page, initials: string, email: string) {
	await personaliseAndAdd(page, initials);
	await page.getByTestId('cart-link').click();
	const total = await fillCheckout(page, email);
	await payWith(page, '4242 4242 4242 4242');
	await expect(page.getByTestId('order-paid')).toBeVisible({ timeout: 15_000 });
	const ref = (await page.getByTestId('order-ref').textContent())!.trim();
	return { ref, total };
}
