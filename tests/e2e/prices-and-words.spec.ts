import { expect, test, type Page } from '@playwright/test';
import { signInAs } from '../helpers/auth';
import { fillCheckout, payWith, personaliseAndAdd } from '../helpers/buy';

/** "$1,234.50" → 123450 minor units (the shop shows US dollars with two decimals). */
const cents = (text: string) => {
	const m = text.replace(/,/g, '').match(/(\d+)\.(\d{2})/);
	if (!m) throw new Error(`no price in "${text}"`);
	return Number(m[1]) * 100 + Number(m[2]);
};

/** Every price the page lets a buyer choose: each ready-now wood and each personaliser wood. */
async function offeredPrices(page: Page): Promise<number[]> {
	const prices: number[] = [];
	const ready = page.getByRole('form', { name: 'Buy one ready now' });
	if (await ready.count()) {
		for (const label of await ready.locator('label:has(input[name="wood"])').all()) {
			prices.push(cents(await label.innerText()));
		}
	}
	const personalise = page.getByRole('region', { name: 'Carved with your initials' });
	if (await personalise.count()) {
		const price = personalise.getByTestId('personaliser-price');
		for (const radio of await personalise.locator('input[name="wood"]').all()) {
			await radio.check({ force: true });
			// The shown price follows the chosen wood (base + that wood's add-on, as the cart prices it).
			await expect(radio).toBeChecked();
			prices.push(cents(await price.innerText()));
		}
	}
	return prices;
}

test('the "from" price on every piece is the cheapest choice offered, on the card and the page', async ({
	page
}) => {
	await page.goto('/shop');
	const cards = await page.getByTestId('piece-card').all();
	// The demo catalogue has eight pieces (DEVELOPERS.md, "Demo data").
	expect(cards.length).toBe(8);
	const shop: { href: string; price: number }[] = [];
	for (const card of cards) {
		shop.push({
			href: (await card.getAttribute('href'))!,
			price: cents(await card.getByTestId('card-from-price').innerText())
		});
	}
	for (const { href, price } of shop) {
		await page.goto(href, { waitUntil: 'networkidle' });
		const from = cents(await page.getByTestId('from-price').innerText());
		const offered = await offeredPrices(page);
		expect(offered.length, `${href} offers something to buy`).toBeGreaterThan(0);
		// The lowest a buyer can pay is the least of the choices the page itself offers.
		expect(from, `${href}: page "from" vs cheapest choice`).toBe(Math.min(...offered));
		expect(from, `${href}: page "from" vs shop card`).toBe(price);
	}
});

test('the nut-allergy caution and the footer lead to the contact page', async ({ page }) => {
	// Walnut is a nut tree (Juglans nigra: common practice); this holder is offered in walnut.
	await page.goto('/shop/rosette-bottle-holder');
	const caution = page.getByRole('note').filter({ hasText: 'Oils and allergies' });
	await caution.getByRole('link', { name: 'write to us before ordering' }).click();
	await expect(page).toHaveURL(/\/contact$/);
	await expect(page.getByRole('heading', { level: 1, name: 'Contact' })).toBeVisible();
	const footer = page.getByRole('navigation', { name: 'Footer' });
	await expect(footer.getByRole('link', { name: 'Contact' })).toHaveAttribute('href', '/contact');
});

test("buyers get care and materials; the carver's safety notes live in the workshop", async ({
	page,
	request
}) => {
	// The old address still works, permanently moved (RFC 9110 §15.4.9: 308 Permanent Redirect).
	const old = await request.get('/safety', { maxRedirects: 0 });
	expect(old.status()).toBe(308);
	expect(old.headers()['location']).toBe('/care');

	await page.goto('/shop');
	await page
		.getByRole('navigation', { name: 'Footer' })
		.getByRole('link', { name: 'Care and materials' })
		.click();
	await expect(page.getByRole('heading', { level: 1, name: 'Care and materials' })).toBeVisible();
	const care = page.locator('main');
	await expect(care).toContainText('For food');
	await expect(care).toContainText('walnut and butternut are nut trees');
	// The carver's own hazards are not the buyer's page.
	await expect(care).not.toContainText('Wood dust');
	await expect(care).not.toContainText('Knives');

	await page.goto('/signin');
	await expect(page.getByRole('link', { name: 'Care and materials' })).toHaveAttribute(
		'href',
		'/care'
	);

	await signInAs(page, 'helper');
	await page.getByRole('link', { name: 'working safely' }).click();
	await expect(page).toHaveURL(/\/workshop\/safety$/);
	const notes = page.locator('main');
	for (const h of ['Oily finishing rags', 'Wood dust', 'Knives']) {
		await expect(notes.getByRole('heading', { name: new RegExp(h) })).toBeVisible();
	}
	await expect(notes).toContainText('follow the local code');
});

test('a declined card is said once, in plain words', async ({ page }) => {
	await personaliseAndAdd(page, 'NW');
	await page.getByTestId('cart-link').click();
	await fillCheckout(page, `funds-${Date.now()}@example.test`);
	// Stripe's test card for "insufficient funds" (its testing docs; mocks/stripe/cards.ts).
	await payWith(page, '4000 0000 0000 9995');
	await expect(page.getByRole('alert')).toContainText(/insufficient funds/i);
	await page.getByRole('link', { name: 'Cancel and go back' }).click();
	const notice = page.getByTestId('payment-not-completed');
	await expect(notice).toContainText('Your card has insufficient funds');
	await expect(notice).toContainText('Nothing was charged');
	const words = (await notice.innerText()).toLowerCase();
	expect(words).not.toContain('not accepted');
	// The reason appears once, not repeated in brackets after a sentence saying the same.
	expect(words.split('insufficient funds').length - 1).toBe(1);
});

test('a personalised line set to 0 can be put back with its initials, wood and style', async ({
	page
}) => {
	await personaliseAndAdd(page, 'UV');
	await page.goto('/cart', { waitUntil: 'networkidle' });
	const line = page.getByTestId('cart-line');
	await expect(line).toHaveCount(1);
	const before = await line.innerText();
	expect(before).toContain('Black cherry');

	const qty = page.getByRole('spinbutton', { name: /How many/ });
	await qty.fill('0');
	await qty.dispatchEvent('change');
	await expect(line).toHaveCount(0);
	const removed = page.getByTestId('removed-line');
	await expect(removed).toContainText('Took out Rosette bottle holder with the initials UV in');
	await expect(page.getByTestId('cart-count')).toHaveText('0');

	await removed.getByRole('button', { name: 'Put it back' }).click();
	await expect(line).toHaveCount(1);
	await expect(page.getByTestId('line-initials')).toHaveText('UV');
	// Same wood, style and price as before it was taken out.
	expect(await line.innerText()).toBe(before);
	await expect(removed).toHaveCount(0);
	await expect(page.getByTestId('cart-count')).toHaveText('1');
});

test('the basket dates a personalised line as the piece page did, from the carving queue', async ({
	page
}) => {
	await personaliseAndAdd(page, 'QT');
	// The personaliser's date for this layout in this wood, from the queue as it stands.
	const promised = (await page.getByTestId('personaliser-ready').innerText()).trim();
	expect(promised).toMatch(/^[A-Z][a-z]{2}, [A-Z][a-z]{2} \d{1,2}$/);
	await page.goto('/cart', { waitUntil: 'networkidle' });
	await expect(page.getByTestId('line-ready-by')).toHaveText(promised);
});
