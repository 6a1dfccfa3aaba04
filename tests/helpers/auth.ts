import { expect, type Page } from '@playwright/test';
import { DEMO_ACCOUNTS } from '../../scripts/seed/demo';
import type { Role } from '../../src/lib/server/db/schema';

export const SESSION_COOKIE = 'chipstall_session';

/** The seeded demo account for a role (demo-only passwords, listed in the README). */
export function demoAccount(role: Role) {
	const account = DEMO_ACCOUNTS.find((a) => a.role === role);
	if (!account) throw new Error(`no demo account with role ${role}`);
	return account;
}

/**
 * Signs in through the real sign-in form as the seeded owner, helper or customer and waits
 * until the page it lands on has loaded. Returns the account used.
 */
export async function signInAs(page: Page, role: Role, next?: string) {
	const account = demoAccount(role);
	await signInWith(page, account.email, account.password, next);
	const home = next ?? (role === 'customer' ? '/account' : '/workshop');
	await expect(page).toHaveURL((url) => url.pathname + url.search === home);
	return account;
}

/** Fills and sends the sign-in form; the caller checks where it led. */
export async function signInWith(page: Page, email: string, password: string, next?: string) {
	await page.goto(next ? `/signin?next=${encodeURIComponent(next)}` : '/signin');
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Password').fill(password);
	await page.getByRole('button', { name: 'Sign in' }).click();
}

/** Signs out with the POST form on the sign-out page. */
export async function signOut(page: Page) {
	await page.goto('/signout');
	await page.getByRole('button', { name: /sign out/i }).click();
	await expect(page).toHaveURL((url) => url.pathname === '/');
}
