import { expect, test, type Page } from '@playwright/test';

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
