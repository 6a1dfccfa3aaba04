import { expect, test, type Browser, type Page } from '@playwright/test';
import { demoAccount, signInAs } from '../../helpers/auth';
import { buyPersonalised } from '../../helpers/buy';
import { mailInboxUrl, parsedMail, waitForMail, type CaughtMail } from '../../helpers/mail';

/**
 * The owner's day, walked as people walk it: a buyer pays in one browser; the owner, in another
 * with no cookies, opens the order from the new-order alert e-mail (read from the mail
 * stand-in's JSON API), signs in, moves it through carving, finishing and packed with a double
 * click on each button, takes it a step back with a reason, ships it with a tracking number;
 * the buyer reads the shipping e-mail (HTML and text) and the order page with the carrier's
 * link, and writes to the shop about the order. A second order is cancelled with a reason and
 * refunded. Reload and Back never show an error page. Every check is what the person sees.
 */
test.describe.configure({ timeout: 180_000 });

// UPS publishes tracking at www.ups.com/track?tracknum=<number> (the carrier's public page).
const TRACKING = '1Z999AA10123456784';
const UPS_LINK = `https://www.ups.com/track?tracknum=${TRACKING}`;

async function freshPage(browser: Browser, viewport = { width: 1280, height: 800 }) {
	const context = await browser.newContext({ viewport });
	return context.newPage();
}

/** No error page: the page's own heading is there and no error words are. */
async function noErrorPage(page: Page) {
	await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
	await expect(page.locator('body')).not.toContainText(/Internal Error|Error 500|^500$/);
}

/** How many history entries read exactly `move` (e.g. "Paid → Carving"). */
async function historyCount(page: Page, move: string) {
	return page.getByTestId('order-history').locator('li strong', { hasText: move }).count();
}

async function inbox(): Promise<CaughtMail[]> {
	return (await (await fetch(mailInboxUrl())).json()) as CaughtMail[];
}

test('from the new-order alert to the shipping e-mail, with a step back and a note from the buyer', async ({
	browser
}) => {
	const buyer = await freshPage(browser, { width: 390, height: 844 });
	const email = `day-${Date.now()}@example.test`;
	const { ref } = await buyPersonalised(buyer, 'RKW', email);

	// The alert, as the owner's mail program gets it: text and HTML, each with the order's link.
	const owner = demoAccount('owner');
	const alert = await waitForMail(owner.email, new RegExp(`New order ${ref}`));
	const alertMail = await parsedMail(alert);
	const alertLink = new URL(
		new RegExp(`https?://\\S+/workshop/orders/${ref}`).exec(alertMail.text as string)![0]
	);
	expect(alertMail.html).toContain(`/workshop/orders/${ref}`);

	// The owner's desk: a browser with no cookies opens the alert's link and is asked to sign in.
	const desk = await freshPage(browser);
	await desk.goto(alertLink.pathname);
	await expect(desk).toHaveURL(/\/signin\?next=/);
	await desk.getByLabel('E-mail').fill(owner.email);
	await desk.getByLabel('Password').fill(owner.password);
	await desk.getByRole('button', { name: 'Sign in' }).click();
	await expect(desk.getByTestId('order-ref')).toHaveText(`Order ${ref}`);
	const status = desk.getByTestId('order-status').first();
	await expect(status).toHaveAttribute('data-status', 'paid');

	// Each move by double click: the order moves once and the history records it once.
	for (const [to, move] of [
		['Carving', 'Paid → Carving'],
		['Finishing', 'Carving → Finishing'],
		['Packed', 'Finishing → Packed']
	] as const) {
		await desk.getByRole('button', { name: `Move to ${to}` }).dblclick();
		await expect(status).toHaveAttribute('data-status', to.toLowerCase());
		await expect(desk.getByTestId('order-history')).toContainText(move);
		expect(await historyCount(desk, move)).toBe(1);
	}
	// A stale tab sending the old move again (as the enhanced form does) changes nothing and
	// says why.
	const again = await desk.request.post(`/workshop/orders/${ref}?/move`, {
		form: { to: 'finishing', expect: 'carving' },
		headers: {
			origin: new URL(desk.url()).origin,
			accept: 'application/json',
			'x-sveltekit-action': 'true'
		}
	});
	const answer = (await again.json()) as { type: string; status: number; data: string };
	expect([answer.type, answer.status]).toEqual(['failure', 409]);
	expect(answer.data).toContain('already');
	await desk.reload();
	await noErrorPage(desk);
	expect(await historyCount(desk, 'Carving → Finishing')).toBe(1);

	// One step back needs a reason; the reason lands in the history.
	const steer = desk.getByTestId('steer');
	await steer.getByLabel(/Why back to Finishing/).fill('  ');
	await steer.getByRole('button', { name: 'Back to Finishing' }).click();
	await expect(steer.getByRole('alert')).toContainText('Say why');
	await expect(status).toHaveAttribute('data-status', 'packed');
	await steer.getByLabel(/Why back to Finishing/).fill('The oil needs another coat');
	await steer.getByRole('button', { name: 'Back to Finishing' }).dblclick();
	await expect(status).toHaveAttribute('data-status', 'finishing');
	await expect(steer).toContainText('Back to Finishing.');
	expect(await historyCount(desk, 'Packed → Finishing')).toBe(1);
	await expect(desk.getByTestId('order-history')).toContainText('The oil needs another coat');
	await desk.getByRole('button', { name: 'Move to Packed' }).dblclick();
	await expect(status).toHaveAttribute('data-status', 'packed');

	// Back to the list and forward again: the pages, never an error.
	await desk.goto('/workshop/orders');
	await expect(desk.locator(`tr[data-ref="${ref}"]`)).toBeVisible();
	await desk.goBack();
	await noErrorPage(desk);
	await expect(desk.getByTestId('order-ref')).toHaveText(`Order ${ref}`);
	await desk.goForward();
	await noErrorPage(desk);
	// The table finds the order by the initials carved and by the buyer's town.
	for (const q of ['RKW', 'boulder']) {
		await desk.getByRole('searchbox', { name: 'Search' }).fill(q);
		await expect(desk).toHaveURL(new RegExp(`[?&]q=${q}`));
		await expect(desk.locator(`tr[data-ref="${ref}"]`)).toBeVisible();
	}
	await desk.locator(`tr[data-ref="${ref}"]`).getByRole('link', { name: ref }).click();

	// Ship with a tracking number (double click: one shipment, one e-mail).
	await desk.getByLabel('Carrier').fill('UPS');
	await desk.getByLabel('Tracking number').fill(TRACKING);
	await desk.getByRole('button', { name: 'Mark shipped and e-mail the buyer' }).dblclick();
	await expect(status).toHaveAttribute('data-status', 'shipped');
	await expect(desk.getByTestId('tracking')).toHaveCount(1);
	expect(await historyCount(desk, 'Packed → Shipped')).toBe(1);

	// The buyer's shipping e-mail, read as a mail program reads it.
	const shipped = await parsedMail(await waitForMail(email, /on its way/));
	expect(shipped.subject).toBe(`Order ${ref} is on its way`);
	expect(shipped.text).toContain(`Tracking number: ${TRACKING}`);
	expect(shipped.text).toContain(UPS_LINK);
	expect(shipped.html).toContain(`href="${UPS_LINK.replace(/&/g, '&amp;')}"`);
	expect(
		(await inbox()).filter((m) => m.to.includes(email) && /on its way/.test(m.subject))
	).toHaveLength(1);

	// The buyer's order page from the e-mail: the tracking number is the carrier's link.
	const orderLink = new URL(/https?:\/\/\S+\/orders\/\S+/.exec(shipped.text as string)![0]);
	await buyer.goto(orderLink.pathname + orderLink.search);
	await expect(buyer.getByRole('heading', { level: 1 })).toHaveText('On its way to you');
	const track = buyer.getByRole('link', { name: TRACKING });
	await expect(track).toHaveAttribute('href', UPS_LINK);
	await buyer.reload();
	await noErrorPage(buyer);

	// Writing to the shop: an empty message is refused beside the field; a real one reaches the
	// owner once, with the order's reference, however often the button is pressed.
	const write = buyer.getByTestId('write-to-shop');
	await write.getByLabel('Your message').fill('   ');
	await write.getByRole('button', { name: 'Send the message' }).click();
	await expect(write.getByRole('alert')).toHaveText('Write your message first.');
	await write.getByLabel('Your message').fill('Could it be gift wrapped? Thank you!');
	await write.getByRole('button', { name: 'Send the message' }).dblclick();
	await expect(write.getByRole('status')).toContainText('Sent.');
	const note = await parsedMail(await waitForMail(owner.email, new RegExp(`about order ${ref}`)));
	expect(note.text).toContain('Could it be gift wrapped? Thank you!');
	expect(note.replyTo?.text).toContain(email);
	await expect
		.poll(
			async () => (await inbox()).filter((m) => m.subject.includes(`about order ${ref}`)).length
		)
		.toBe(1);
	await buyer.goBack();
	await noErrorPage(buyer);
	await buyer.context().close();
	await desk.context().close();
});

test('the owner cancels a paid order with a reason: refunded, the buyer told, once', async ({
	browser
}) => {
	const buyer = await freshPage(browser);
	const email = `cancel-${Date.now()}@example.test`;
	const { ref, total } = await buyPersonalised(buyer, 'KWR', email);
	const desk = await freshPage(browser);
	await signInAs(desk, 'owner', `/workshop/orders/${ref}`);
	const status = desk.getByTestId('order-status').first();
	await desk.getByRole('button', { name: 'Move to Carving' }).click();
	await expect(status).toHaveAttribute('data-status', 'carving');

	const steer = desk.getByTestId('steer');
	await steer.getByLabel(/Why cancel/).fill('The blank split along the grain');
	await steer.getByRole('button', { name: `Cancel and refund ${total}` }).dblclick();
	await expect(status).toHaveAttribute('data-status', 'refunded');
	await expect(steer).toHaveCount(0);
	await expect(desk.getByTestId('order-history')).toContainText('The blank split along the grain');
	expect(await historyCount(desk, 'Carving → Refunded')).toBe(1);
	await expect(desk.getByTestId('refunds').locator('li')).toHaveCount(1);

	const mail = await parsedMail(await waitForMail(email, /Refund of/));
	expect(mail.text).toContain('The blank split along the grain');
	await desk.reload();
	await noErrorPage(desk);

	// The table shows it among the closed orders, not those that need doing.
	await desk.goto(`/workshop/orders?q=${ref}`);
	await expect(desk.getByText('No orders match these filters.')).toBeVisible();
	await desk.getByRole('link', { name: 'Shipped and closed' }).click();
	const row = desk.locator(`tr[data-ref="${ref}"]`);
	await expect(row.getByTestId('refunded')).toHaveText('refunded in full');
	await desk.context().close();
	await buyer.context().close();
});

test('a helper’s Today offers no refund; the owner’s does', async ({ page }) => {
	// The demo seed holds one paid order whose piece sold meanwhile (CS-1013).
	await signInAs(page, 'helper');
	await expect(page.getByTestId('resolve-advice')).toBeVisible();
	await expect(page.locator('main')).not.toContainText(/refund/i);
	await page.goto('/signout');
	await page.getByRole('button', { name: /sign out/i }).click();
	await signInAs(page, 'owner');
	await expect(page.getByTestId('resolve-advice')).toContainText('Refund');
});
