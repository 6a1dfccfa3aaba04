import { expect, test } from '@playwright/test';
import { signInAs } from '../../helpers/auth';
import { buyPersonalised } from '../../helpers/buy';

/**
 * Mail that cannot be delivered, walked as people meet it: a buyer on a phone pays with an
 * address whose server refuses it for good (the mail stand-in answers 550 for any recipient at
 * refuse-permanent.test). The order is paid all the same; the owner, on a phone, finds the
 * letter under "Mail that could not be delivered" on Today with the address, the subject and
 * the server's reason, taps "Try again" twice (refused again, still listed once, no error page),
 * reloads, goes Back and Forward. A helper does not see the list.
 */
test.describe.configure({ timeout: 180_000 });

test('a refused address shows on the owner’s Today with the reason and a try again', async ({
	browser
}) => {
	const phone = { viewport: { width: 390, height: 844 } };
	const buyer = await (await browser.newContext(phone)).newPage();
	const email = `typo-${Date.now()}@refuse-permanent.test`;
	const { ref } = await buyPersonalised(buyer, 'TYP', email);

	const owner = await (await browser.newContext(phone)).newPage();
	await signInAs(owner, 'owner');
	const list = owner.getByTestId('undelivered-mail');
	const item = list.locator('li', { hasText: email });
	// The drainer or the payment's own first try has been refused by now, or soon.
	await expect(async () => {
		await owner.reload();
		await expect(item).toBeVisible({ timeout: 1000 });
	}).toPass({ timeout: 30_000 });
	await expect(list.getByRole('heading')).toHaveText('Mail that could not be delivered');
	await expect(item).toContainText(ref);
	await expect(item).toContainText(/550/);
	await expect(item).toContainText(/no such mailbox/);

	await item.getByRole('button', { name: 'Try again' }).dblclick();
	await expect(owner.getByRole('heading', { level: 1 })).toHaveText('Today in the workshop');
	// Refused again: still listed, once.
	await expect(list.locator('li', { hasText: email })).toHaveCount(1);
	await owner.reload();
	await expect(list.locator('li', { hasText: email })).toHaveCount(1);
	await owner.goto('/workshop/orders');
	await owner.goBack();
	await expect(list.locator('li', { hasText: email })).toHaveCount(1);
	await owner.goForward();
	await expect(owner).toHaveURL(/\/workshop\/orders/);

	const helper = await (await browser.newContext(phone)).newPage();
	await signInAs(helper, 'helper');
	await expect(helper.getByRole('heading', { level: 1 })).toHaveText('Today in the workshop');
	await expect(helper.getByTestId('undelivered-mail')).toHaveCount(0);
});
