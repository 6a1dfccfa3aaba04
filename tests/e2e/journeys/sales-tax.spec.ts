import { expect, test, type Page } from '@playwright/test';
import { signInAs } from '../../helpers/auth';

/**
 * The owner sets the online sales tax (rate and basis) in Settings, next to the caution that the
 * rules are local; a visitor's basket and checkout then tax by it. Expected amounts follow the
 * Streamlined Sales and Use Tax Agreement §324 rounding rule as written (carry the tax to the
 * third decimal place of a dollar, round up when that digit is more than four), on the item or
 * the invoice basis it allows.
 */

/** §324 on decimal digits: tax in cents on an amount in cents at a rate in basis points. */
function section324(amountCents: number, rateBp: number): number {
	const thousandths = (BigInt(amountCents) * BigInt(rateBp)) / 1000n;
	return Number(thousandths / 10n + (thousandths % 10n > 4n ? 1n : 0n));
}
const itemBasis = (lines: number[], bp: number) => lines.reduce((a, l) => a + section324(l, bp), 0);
const invoiceBasis = (lines: number[], bp: number) =>
	section324(
		lines.reduce((a, l) => a + l, 0),
		bp
	);
/** Cents as the demo shop (en-US, USD) writes them. */
const dollars = (cents: number) =>
	`$${Math.trunc(cents / 100)}.${String(cents % 100).padStart(2, '0')}`;

async function saveTax(page: Page, rate: string, basis: RegExp) {
	await page.goto('/workshop/settings');
	const form = page.locator('form[action="?/tax"]');
	await form.getByLabel('Rate (%)').fill(rate);
	await form.getByRole('radio', { name: basis }).check();
	// A double tap writes the same setting twice: harmless, one confirmation.
	await form.getByRole('button', { name: 'Save' }).dblclick();
	return form;
}

test.describe('sales tax on online orders', () => {
	test.setTimeout(120_000);

	test('the owner sets rate and basis; the basket and checkout tax by them', async ({
		page,
		browser
	}) => {
		await signInAs(page, 'owner');
		await page.goto('/workshop/settings');
		await expect(page.getByText(/licensed accountant/)).toBeVisible();

		// Bad input: a sentence beside the field, the page stays, nothing saved.
		const form = page.locator('form[action="?/tax"]');
		await form.getByLabel('Rate (%)').fill('seven');
		await form.getByRole('button', { name: 'Save' }).click();
		await expect(form.getByText('Type a percentage like 7.25, or 0 for none.')).toBeVisible();
		// Without script, a basis the form never offers: a 400 page with its sentence.
		const res = await page.request.post('/workshop/settings?/tax', {
			headers: {
				'content-type': 'application/x-www-form-urlencoded',
				accept: 'text/html',
				origin: new URL(page.url()).origin
			},
			data: 'rate=7.25&basis=per-piece',
			maxRedirects: 0
		});
		expect(res.status()).toBe(400);
		expect(await res.text()).toContain(
			'Choose whether tax is worked out on each line or once on the whole order.'
		);

		// A visitor's basket: two different ready-made pieces.
		const visitor = await browser.newContext();
		try {
			const v = await visitor.newPage();
			await v.goto('/');
			for (const [slug, wood] of [
				['trinket-box', 'basswood'],
				['coffee-scoop', 'cherry']
			])
				expect((await v.request.post('/api/cart', { data: { slug, wood } })).ok()).toBe(true);
			const cart = (await (await v.request.get('/api/cart')).json()) as {
				lines: { totalMinor: number }[];
			};
			const lines = cart.lines.map((l) => l.totalMinor);
			expect(lines).toHaveLength(2);
			// A usual rate (4 % to 10 %, in hundredths of a percent) where the two bases differ.
			const rateBp = [...Array(600).keys()]
				.map((r) => 400 + r)
				.find((r) => itemBasis(lines, r) !== invoiceBasis(lines, r))!;
			expect(rateBp).toBeDefined();
			const rate = `${Math.trunc(rateBp / 100)}.${String(rateBp % 100).padStart(2, '0')}`;

			const saved = await saveTax(page, rate, /Once on the whole order/);
			await expect(saved.getByRole('status')).toHaveText(
				`Saved. New checkouts use ${rate} %, once on the whole order.`
			);
			// Reload: the choice is kept.
			await page.reload();
			await expect(form.getByLabel('Rate (%)')).toHaveValue(rate);
			await expect(form.getByRole('radio', { name: /Once on the whole order/ })).toBeChecked();

			await v.goto('/cart');
			await expect(v.getByTestId('cart-tax')).toHaveText(dollars(invoiceBasis(lines, rateBp)));
			await v.goto('/checkout');
			await expect(v.getByTestId('checkout-tax')).toHaveText(dollars(invoiceBasis(lines, rateBp)));

			await saveTax(page, rate, /On each line/);
			await expect(form.getByRole('status')).toHaveText(
				`Saved. New checkouts use ${rate} %, on each line.`
			);
			await v.goto('/cart');
			await expect(v.getByTestId('cart-tax')).toHaveText(dollars(itemBasis(lines, rateBp)));
		} finally {
			await visitor.close();
			// Back to the demo's no tax, per line, for the specs after this one.
			const reset = await saveTax(page, '0', /On each line/);
			await expect(reset.getByRole('status')).toHaveText(
				'Saved. New checkouts use 0.00 %, on each line.'
			);
		}
	});
});
