import { expect, test, type Page } from '@playwright/test';

/**
 * Initials a knife cannot cut cleanly are not sold: on the demo serving plate (36 mm rosettes),
 * two letters come out about 5 mm tall with strokes under 1 mm, below black cherry's minimum
 * (4.9 mm letters, 1.0 mm strokes: basswood's 6 mm / 1.2 mm, common practice, scaled by our own
 * hardness model), so the page refuses them and offers the ways out that make them cuttable.
 */
const PLATE = '/shop/rim-rosette-serving-plate';

async function typeOnPlate(page: Page, initials: string) {
	await page.goto(PLATE, { waitUntil: 'networkidle' });
	const field = page.getByRole('textbox', { name: 'Initials' });
	await field.fill(initials);
	await expect(page.getByTestId('personaliser-preview').locator('svg title').first()).toContainText(
		`initials ${initials}`
	);
}

const addButton = (page: Page) =>
	page.getByRole('button', { name: 'Add to basket with these initials' });

test.describe('letters that cannot be carved', () => {
	test('a two-letter plate refused with the three offered ways out', async ({ page }) => {
		await typeOnPlate(page, 'AB');
		const refusal = page.getByTestId('letters-refused');
		await expect(refusal).toBeVisible();
		await expect(refusal).toContainText('Too small to carve');
		await expect(refusal).toContainText('at least 4.9 mm tall');
		await expect(addButton(page)).toBeDisabled();
		await refusal.screenshot({ path: test.info().outputPath('refused.png') });

		// Add to basket does not add, even forced.
		await addButton(page).click({ force: true });
		await expect(page.getByTestId('added-notice')).toHaveCount(0);

		// The ways out: fewer letters, the larger style, a piece with a larger rosette (and here
		// also a wood that holds finer detail).
		const fewer = refusal.getByRole('button', { name: /Keep “A” only/ });
		const style = refusal.getByRole('button', { name: /Open centre/ });
		const piece = refusal.getByRole('link', { name: /rosette carves “AB”/ });
		await expect(fewer).toBeVisible();
		await expect(style).toBeVisible();
		await expect(piece).toBeVisible();
		await expect(refusal.getByRole('button', { name: /sugar maple/ })).toBeVisible();
		// The server chose a personalisable piece with a larger rosette: its page opens.
		const href = await piece.getAttribute('href');
		expect(href).toMatch(/^\/shop\/[a-z0-9-]+$/);
		expect(href).not.toBe(PLATE);

		// Taking the larger style keeps both letters and makes the plate addable.
		await style.click();
		await expect(refusal).toHaveCount(0);
		await expect(page.getByRole('textbox', { name: 'Initials' })).toHaveValue('AB');
		await expect(addButton(page)).toBeEnabled();
		await page
			.getByTestId('personaliser-preview')
			.screenshot({ path: test.info().outputPath('open-centre.png') });
		await addButton(page).click();
		await expect(page.getByTestId('added-notice')).toBeVisible();

		// Fewer letters is a way out too.
		await typeOnPlate(page, 'AB');
		await page
			.getByTestId('letters-refused')
			.getByRole('button', { name: /Keep “A” only/ })
			.click();
		await expect(page.getByRole('textbox', { name: 'Initials' })).toHaveValue('A');
		await expect(page.getByTestId('letters-refused')).toHaveCount(0);
		await expect(addButton(page)).toBeEnabled();
	});

	test('the cart API refuses the same layout with a 400 naming the minimum', async ({
		request
	}) => {
		const res = await request.post('/api/cart', {
			data: { slug: 'rim-rosette-serving-plate', wood: 'cherry', initials: 'AB', style: 'classic' }
		});
		expect(res.status()).toBe(400);
		const body = (await res.json()) as { error: string };
		expect(body.error).toMatch(/at least 4\.9 mm tall with strokes at least 1 mm wide/);
		const ok = await request.post('/api/cart', {
			data: { slug: 'rim-rosette-serving-plate', wood: 'cherry', initials: 'AB', style: 'open' }
		});
		expect(ok.status()).toBe(200);
	});

	test('on a phone the preview stays in view while choosing a style or a wood', async ({
		page
	}) => {
		await page.setViewportSize({ width: 390, height: 844 });
		await page.goto('/shop/rosette-bottle-holder', { waitUntil: 'networkidle' });
		const preview = page.getByTestId('personaliser-preview');
		const inView = async () => {
			const box = await preview.boundingBox();
			expect(box).not.toBeNull();
			expect(box!.y).toBeGreaterThanOrEqual(0);
			expect(box!.y + box!.height).toBeLessThanOrEqual(844);
		};
		await page.getByText('Split petals').click();
		await page.screenshot({ path: test.info().outputPath('phone-after-style.png') });
		await inView();
		await page
			.getByRole('region', { name: 'Carved with your initials' })
			.locator('label', { hasText: 'Black walnut' })
			.click();
		await page.screenshot({ path: test.info().outputPath('phone-after-wood.png') });
		await inView();
	});
});
