/**
 * Accessibility of the screens people use most, checked with axe-core (Deque's rule engine,
 * through @axe-core/playwright) for WCAG 2.1 A/AA rules: no serious or critical findings. Each
 * screen is also walked with the Tab key: focus moves, and the focused control shows a visible
 * outline (WCAG 2.4.7 Focus Visible).
 *
 * To cover a new screen, add a row to SCREENS.
 */
import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { signInAs } from './helpers/auth';
import type { Role } from '../../src/lib/server/db/schema';

type Screen = { name: string; path: string; role?: Role; prepare?: (page: Page) => Promise<void> };

async function basketWithOnePiece(page: Page) {
	await page.goto('/shop/rosette-bottle-holder', { waitUntil: 'networkidle' });
	const section = page.getByRole('region', { name: 'Carved with your initials' });
	await section.getByRole('textbox', { name: 'Initials' }).fill('HM');
	await page.getByRole('button', { name: 'Add to basket with these initials' }).click();
	await expect(page.getByTestId('cart-count')).toHaveText('1');
}

const SCREENS: Screen[] = [
	{ name: 'shop', path: '/shop' },
	{ name: 'piece page with the personaliser', path: '/shop/rosette-bottle-holder' },
	{ name: 'basket', path: '/cart', prepare: basketWithOnePiece },
	{ name: 'checkout', path: '/checkout', prepare: basketWithOnePiece },
	{ name: 'sign-in', path: '/signin' },
	{ name: 'order page (buyer)', path: '/orders/CS-1001', role: 'customer' },
	{ name: 'orders table', path: '/workshop/orders', role: 'owner' },
	{ name: 'order page (workshop)', path: '/workshop/orders/CS-1001', role: 'owner' }
	// Booth and tally screens: add their rows here when those routes exist.
];

const FOCUS_STOPS = 6;

for (const screen of SCREENS) {
	test(`accessibility: ${screen.name}`, async ({ page }) => {
		if (screen.role) await signInAs(page, screen.role, screen.path);
		if (screen.prepare) await screen.prepare(page);
		await page.goto(screen.path);
		await page.waitForLoadState('networkidle');

		const results = await new AxeBuilder({ page })
			.withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'])
			.analyze();
		const bad = results.violations
			.filter((v) => v.impact === 'serious' || v.impact === 'critical')
			.map((v) => `${v.id} (${v.impact}): ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
		expect(bad, 'serious or critical axe findings').toEqual([]);

		// Keyboard alone: each Tab lands on a different visible control with a focus outline.
		const seen = new Set<string>();
		for (let i = 0; i < FOCUS_STOPS; i++) {
			await page.keyboard.press('Tab');
			const focus = await page.evaluate(() => {
				const el = document.activeElement as HTMLElement | null;
				if (!el || el === document.body) return null;
				const cs = getComputedStyle(el);
				const r = el.getBoundingClientRect();
				return {
					id: `${el.tagName}:${el.textContent?.trim().slice(0, 30)}:${r.x},${r.y}`,
					outline: cs.outlineStyle !== 'none' && parseFloat(cs.outlineWidth) >= 1,
					ring: cs.boxShadow !== 'none',
					visible: r.width > 0 && r.height > 0
				};
			});
			expect(focus, `Tab ${i + 1} reaches a control`).not.toBeNull();
			expect(focus!.visible, `Tab ${i + 1}: ${focus!.id} is visible`).toBe(true);
			expect(focus!.outline || focus!.ring, `Tab ${i + 1}: ${focus!.id} shows focus`).toBe(true);
			seen.add(focus!.id);
		}
		expect(seen.size).toBeGreaterThan(1);
	});
}
