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
import { signInAs } from '../helpers/auth';
import type { Role } from '../../src/lib/server/db/schema';

type Screen = {
	name: string;
	/** A path, or a function finding it once signed in (a fair's pages need the fair's id). */
	path: string | ((page: Page) => Promise<string>);
	role?: Role;
	prepare?: (page: Page) => Promise<void>;
	/** After the page loads: put it in the state worth checking (e.g. a sale under way). */
	then?: (page: Page) => Promise<void>;
	/** A phone's viewport, for screens used on a phone. */
	phone?: boolean;
	/**
	 * Also hold text to WCAG 2.1 SC 1.4.6 (enhanced contrast, 7:1; 4.5:1 for large text), well
	 * above the AA minimum of 4.5:1: for the booth screen, read outdoors in daylight.
	 */
	enhancedContrast?: boolean;
};

async function basketWithOnePiece(page: Page) {
	await page.goto('/shop/rosette-bottle-holder', { waitUntil: 'networkidle' });
	const section = page.getByRole('region', { name: 'Carved with your initials' });
	await section.getByRole('textbox', { name: 'Initials' }).fill('HM');
	await page.getByRole('button', { name: 'Add to basket with these initials' }).click();
	await expect(page.getByTestId('cart-count')).toHaveText('1');
}

/** A page of the demo's open fair (loaded out, selling today), found from the fairs list. */
function openFairPage(sub: string) {
	return async (page: Page) => {
		await page.goto('/workshop/fairs');
		const href = await page
			.getByRole('link', { name: 'Riverbank Winter Market' })
			.first()
			.getAttribute('href');
		expect(href).toMatch(/^\/workshop\/fairs\/\d+$/);
		return `${href}${sub}`;
	};
}

const SCREENS: Screen[] = [
	{ name: 'shop', path: '/shop' },
	{ name: 'piece page with the personaliser', path: '/shop/rosette-bottle-holder' },
	{
		name: 'piece page, initials refused with the ways out',
		path: '/shop/rim-rosette-serving-plate',
		then: async (page) => {
			await page.getByRole('textbox', { name: 'Initials' }).fill('AB');
			await expect(page.getByTestId('letters-refused')).toBeVisible();
		}
	},
	{ name: 'basket', path: '/cart', prepare: basketWithOnePiece },
	{ name: 'checkout', path: '/checkout', prepare: basketWithOnePiece },
	{ name: 'sign-in', path: '/signin' },
	{ name: 'order page (buyer)', path: '/orders/CS-1001', role: 'customer' },
	{ name: 'orders table', path: '/workshop/orders', role: 'owner' },
	{ name: 'order page (workshop)', path: '/workshop/orders/CS-1001', role: 'owner' },
	{
		name: 'booth screen on a phone, a sale under way',
		path: openFairPage('/booth'),
		role: 'helper',
		phone: true,
		enhancedContrast: true,
		then: async (page) => {
			await page.getByRole('button', { name: /^Add Rosette ornament, Basswood/ }).click();
			await expect(page.getByRole('button', { name: 'Record the sale' })).toBeVisible();
		}
	},
	{ name: 'tally', path: openFairPage('/tally'), role: 'owner' }
];

const FOCUS_STOPS = 6;
/** axe-core rule ids (Deque's rule descriptions), run on every screen whatever their impact. */
const LANDMARK_RULES = [
	'region',
	'landmark-unique',
	'landmark-one-main',
	'landmark-no-duplicate-main',
	'landmark-no-duplicate-banner',
	'landmark-no-duplicate-contentinfo',
	'skip-link',
	'bypass'
];

for (const screen of SCREENS) {
	test(`accessibility: ${screen.name}`, async ({ page }) => {
		if (screen.phone) await page.setViewportSize({ width: 390, height: 844 });
		if (screen.role) await signInAs(page, screen.role);
		const path = typeof screen.path === 'string' ? screen.path : await screen.path(page);
		if (screen.prepare) await screen.prepare(page);
		await page.goto(path);
		await page.waitForLoadState('networkidle');
		if (screen.then) await screen.then(page);

		const results = await new AxeBuilder({ page })
			.withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'])
			.analyze();
		const bad = results.violations
			.filter((v) => v.impact === 'serious' || v.impact === 'critical')
			.map((v) => `${v.id} (${v.impact}): ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
		expect(bad, 'serious or critical axe findings').toEqual([]);
		// axe files its landmark rules under best practice, not under the WCAG tags above, and rates
		// some "moderate": run them by name and allow none, so every bit of content sits in a
		// landmark and no two landmarks of a kind share a name.
		const landmarks = await new AxeBuilder({ page }).withRules(LANDMARK_RULES).analyze();
		const unplaced = landmarks.violations.map(
			(v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`
		);
		expect(unplaced, 'landmark findings').toEqual([]);
		if (screen.enhancedContrast) {
			const enhanced = await new AxeBuilder({ page })
				.withRules(['color-contrast-enhanced'])
				.analyze();
			const low = enhanced.violations.flatMap((v) =>
				v.nodes.map((n) => `${n.target.join(' ')}: ${n.any[0]?.message ?? v.help}`)
			);
			expect(low, 'text below 7:1 (4.5:1 when large) on the booth').toEqual([]);
		}

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

// WCAG 2.4.1 Bypass Blocks: the first Tab stop on each kind of page skips the header and nav.
const SKIP_PAGES: Pick<Screen, 'name' | 'path' | 'role'>[] = [
	{ name: 'shop', path: '/shop' },
	{ name: 'sign-in', path: '/signin' },
	{ name: 'a page that is not there', path: '/no-such-page' },
	{ name: 'workshop orders', path: '/workshop/orders', role: 'owner' },
	{ name: 'booth', path: openFairPage('/booth'), role: 'helper' }
];

for (const screen of SKIP_PAGES) {
	test(`skip link: ${screen.name}`, async ({ page }) => {
		if (screen.role) await signInAs(page, screen.role);
		await page.goto(typeof screen.path === 'string' ? screen.path : await screen.path(page));
		await page.waitForLoadState('networkidle');
		const skip = page.getByRole('link', { name: 'Skip to the main content' });
		await expect(skip).not.toBeInViewport();
		await page.keyboard.press('Tab');
		await expect(skip).toBeFocused();
		await expect(skip).toBeVisible();
		await expect(skip).toBeInViewport();
		const box = await skip.boundingBox();
		expect(box!.width).toBeGreaterThan(40);
		await page.keyboard.press('Enter');
		await expect(page.locator('main#main')).toBeFocused();
		// The next Tab continues inside the main content, not back in the header.
		await page.keyboard.press('Tab');
		const inMain = await page.evaluate(() => !!document.activeElement?.closest('main'));
		expect(inMain, 'Tab after the skip link lands inside main').toBe(true);
	});
}
