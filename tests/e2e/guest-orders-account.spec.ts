import { expect, test } from '@playwright/test';
import { buyPersonalised } from '../helpers/buy';
import { signInWith } from '../helpers/auth';
import { waitForMail } from '../helpers/mail';

/**
 * A buyer who ordered as a guest and later makes an account with that e-mail finds the order in
 * it, but only after opening the link mailed to that address: whoever types an address into the
 * sign-up form must not see its orders (OWASP ASVS 4.0 V2.5.2, the account made only from the
 * e-mailed link — from memory). Test card 4242 4242 4242 4242 succeeds (Stripe's testing docs).
 */
test.describe.configure({ timeout: 90_000 });

const NO_MATCH = "That e-mail and password don't match an account.";

test('guest orders appearing after sign-up and e-mail confirmation', async ({ page }) => {
	const email = `guest-${Date.now()}@example.test`;
	const password = 'a good long password';
	const { ref } = await buyPersonalised(page, 'GO', email);

	// Sign up with the same address, typed the way people type it.
	await page.goto('/signup');
	await page.getByLabel('Your name').fill('Marigold Fenn');
	await page.getByLabel('E-mail').fill(`  ${email.toUpperCase()}`);
	await page.getByLabel('Password', { exact: true }).fill(password);
	await page.getByLabel('Password again').fill(password);
	await page.getByRole('button', { name: 'Make my account' }).click();
	await expect(page.getByText('Open the link in it within a day')).toBeVisible();

	// Not confirmed yet: there is no account to sign in to, so nothing of the order shows.
	await signInWith(page, email, password);
	await expect(page.getByText(NO_MATCH)).toBeVisible();
	expect((await page.goto('/account'))?.url()).toMatch(/\/signin\?next=/);

	const mail = await waitForMail(email, /Welcome to Chipstall/);
	expect(mail.text).toContain('Orders you have already placed with this address');
	const link = mail.text.match(/https?:\/\/\S+\/signup\/[a-z0-9]+/)?.[0];
	expect(link, 'confirmation link in the welcome e-mail').toBeTruthy();
	await page.goto(link!);
	await page.getByRole('button', { name: 'Open my account' }).click();

	await expect(page).toHaveURL(/\/account$/);
	const list = page.getByTestId('account-orders');
	await expect(list).toContainText(ref);
	await expect(page.getByTestId('confirm-email-note')).toHaveCount(0);
	// The order opens from the account, without the e-mailed order link.
	await list.getByRole('link', { name: new RegExp(ref) }).click();
	await expect(page).toHaveURL(new RegExp(`/orders/${ref}$`));
	await expect(page.getByText(ref).first()).toBeVisible();
});
