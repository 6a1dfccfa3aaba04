/**
 * Sign-in and roles, end to end: who may open the workshop, sign-up, sign-in errors that do not
 * say which part was wrong, the e-mailed reset link that works once, and sign-out by POST.
 */
import { expect, test, type Page } from '@playwright/test';
import { SESSION_COOKIE, demoAccount, signInAs, signInWith, signOut } from '../helpers/auth';
import { waitForMail } from '../helpers/mail';

const NO_MATCH = "That e-mail and password don't match an account.";
const unique = (tag: string) =>
	`${tag}-${Date.now()}-${Math.floor(Math.random() * 1e6)}@example.test`;

async function fillSignUp(page: Page, name: string, email: string, password: string) {
	await page.goto('/signup');
	await page.getByLabel('Your name').fill(name);
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Password', { exact: true }).fill(password);
	await page.getByLabel('Password again').fill(password);
	await page.getByRole('button', { name: 'Make my account' }).click();
}

/** Sign-up, then the e-mailed link that makes the account and signs in. */
async function signUp(page: Page, name: string, email: string, password: string) {
	await fillSignUp(page, name, email, password);
	await expect(page.getByText('Open the link in it within a day')).toBeVisible();
	const mail = await waitForMail(email, /Welcome to Chipstall/);
	const link = mail.text.match(/https?:\/\/\S+\/signup\/[a-z0-9]+/)?.[0];
	expect(link, 'sign-up link in the e-mail text').toBeTruthy();
	await page.goto(link!);
	await page.getByRole('button', { name: 'Open my account' }).click();
}

test.describe('who may open the workshop', () => {
	test('anonymous visitors are sent to sign in, and come back after', async ({ page }) => {
		const res = await page.goto('/workshop/people');
		expect(res?.request().redirectedFrom()?.url()).toMatch(/\/workshop\/people$/);
		await expect(page).toHaveURL(/\/signin\?next=%2Fworkshop%2Fpeople$/);
		const owner = demoAccount('owner');
		await page.getByLabel('E-mail').fill(owner.email);
		await page.getByLabel('Password').fill(owner.password);
		await page.getByRole('button', { name: 'Sign in' }).click();
		await expect(page).toHaveURL(/\/workshop\/people$/);
		await expect(page.getByRole('heading', { name: 'People' })).toBeVisible();
	});

	test('a customer gets 403', async ({ page }) => {
		await signInAs(page, 'customer');
		const res = await page.goto('/workshop');
		expect(res?.status()).toBe(403);
		await expect(page.getByTestId('error-message')).toContainText('cannot open');
	});

	test('a helper gets 200, but not the owner-only people page', async ({ page }) => {
		await signInAs(page, 'helper');
		expect((await page.goto('/workshop'))?.status()).toBe(200);
		await expect(page.getByRole('heading', { name: 'Today in the workshop' })).toBeVisible();
		expect((await page.goto('/workshop/people'))?.status()).toBe(403);
	});

	test('the owner gets 200 on the workshop and people pages', async ({ page }) => {
		await signInAs(page, 'owner');
		expect((await page.goto('/workshop'))?.status()).toBe(200);
		expect((await page.goto('/workshop/people'))?.status()).toBe(200);
		await expect(page.getByTestId('staff-list')).toContainText(demoAccount('helper').email);
	});

	test('a `next` pointing off the site is ignored', async ({ page }) => {
		await signInWith(
			page,
			demoAccount('helper').email,
			demoAccount('helper').password,
			'//elsewhere.example/x'
		);
		await expect(page).toHaveURL((url) => url.pathname === '/workshop');
	});
});

test.describe('signing in and up', () => {
	test('a wrong password and an unknown e-mail get the same message, e-mail kept', async ({
		page
	}) => {
		const owner = demoAccount('owner');
		await signInWith(page, owner.email, 'not-the-password');
		await expect(page.getByRole('alert')).toContainText(NO_MATCH);
		await expect(page.getByLabel('E-mail')).toHaveValue(owner.email);
		await expect(page.getByLabel('Password')).toHaveValue('');
		const wrongPassword = await page.getByRole('alert').innerText();

		const stranger = unique('stranger');
		await signInWith(page, stranger, 'not-the-password');
		await expect(page.getByRole('alert')).toContainText(NO_MATCH);
		await expect(page.getByLabel('E-mail')).toHaveValue(stranger);
		expect(await page.getByRole('alert').innerText()).toBe(wrongPassword);
	});

	test('the session cookie is HttpOnly and SameSite=Lax', async ({ page, context }) => {
		await signInAs(page, 'customer');
		const cookie = (await context.cookies()).find((c) => c.name === SESSION_COOKIE);
		expect(cookie?.httpOnly).toBe(true);
		expect(cookie?.sameSite).toBe('Lax');
		expect(cookie?.path).toBe('/');
	});

	// OWASP ASVS 4.0 V2.5.2: the form must not tell who has an account; the owner is told instead.
	test('sign-up makes a customer from the e-mailed link; the same e-mail again looks the same and mails the owner', async ({
		page
	}) => {
		const email = unique('newbuyer');
		await signUp(page, 'Ada Linden', email, 'a good long password');
		await expect(page).toHaveURL(/\/account$/);
		await expect(page.getByTestId('account-email')).toHaveText(email);
		expect((await page.goto('/workshop'))?.status()).toBe(403);
		await signOut(page);

		await fillSignUp(page, 'Ada Again', email.toUpperCase(), 'another long password');
		await expect(page.getByText('Open the link in it within a day')).toBeVisible();
		await expect(page.getByText('already exists')).toHaveCount(0);
		const note = await waitForMail(email, /tried to make/);
		expect(note.text).toContain('You already have one');
	});

	test('sign-up explains a short password and a mismatch beside the fields', async ({ page }) => {
		await page.goto('/signup');
		await page.getByLabel('Your name').fill('Short');
		await page.getByLabel('E-mail').fill(unique('short'));
		await page.getByLabel('Password', { exact: true }).fill('short');
		await page.getByLabel('Password again').fill('different');
		await page.getByRole('button', { name: 'Make my account' }).click();
		await expect(page.locator('#password-error')).toHaveText('Use at least 10 characters.');
		await expect(page.locator('#confirm-error')).toHaveText('The two passwords are not the same.');
	});
});

test.describe('password reset', () => {
	test('the e-mailed link sets a new password once, then says it was used', async ({
		page,
		baseURL
	}) => {
		test.slow(); // five sign-ins and a mail round trip
		const email = unique('forgetful');
		await signUp(page, 'Fern Forgetful', email, 'the first password');
		await expect(page).toHaveURL(/\/account$/);
		await signOut(page);

		// Someone without an account gets the very same answer.
		await page.goto('/reset');
		await page.getByLabel('E-mail').fill(unique('nobody'));
		await page.getByRole('button', { name: 'Send me a link' }).click();
		const neutral = page.getByText('a link to reset its password is on its way');
		await expect(neutral).toBeVisible();

		await page.goto('/reset');
		await page.getByLabel('E-mail').fill(email);
		await page.getByRole('button', { name: 'Send me a link' }).click();
		await expect(neutral).toBeVisible();

		const mail = await waitForMail(email, /reset/i);
		const link = mail.text.match(/https?:\/\/\S+\/reset\/[a-z0-9]+/)?.[0];
		expect(link, 'reset link in the e-mail text').toBeTruthy();
		expect(new URL(link!).origin).toBe(new URL(baseURL!).origin);

		await page.goto(link!);
		await page.getByLabel('New password', { exact: true }).fill('the second password');
		await page.getByLabel('New password again').fill('the second password');
		await page.getByRole('button', { name: 'Save the new password' }).click();
		await expect(page).toHaveURL(/\/account$/);
		await expect(page.getByTestId('account-email')).toHaveText(email);
		await signOut(page);

		await page.goto(link!);
		await expect(page.getByRole('alert')).toContainText('This link has been used');
		await expect(page.getByLabel('New password', { exact: true })).toHaveCount(0);

		await signInWith(page, email, 'the first password');
		await expect(page.getByRole('alert')).toContainText(NO_MATCH);
		await signInWith(page, email, 'the second password');
		await expect(page).toHaveURL(/\/account$/);
	});

	test('a made-up link gets a clear message', async ({ page }) => {
		await page.goto('/reset/thisisnotarealtoken');
		await expect(page.getByRole('alert')).toContainText('This link does not work');
	});
});

test.describe('signing out', () => {
	test('a GET does not sign out; the POST ends the session on the server', async ({
		page,
		context
	}) => {
		await signInAs(page, 'customer');
		const before = (await context.cookies()).find((c) => c.name === SESSION_COOKIE)!;

		// Visiting the address only shows the button.
		await page.goto('/signout');
		expect((await page.goto('/account'))?.status()).toBe(200);
		await expect(page.getByTestId('account-email')).toHaveText(demoAccount('customer').email);

		await signOut(page);
		await page.goto('/account');
		await expect(page).toHaveURL(/\/signin\?next=%2Faccount$/);

		// The old cookie, put back, no longer opens anything: the session is gone server-side.
		await context.addCookies([before]);
		await page.goto('/account');
		await expect(page).toHaveURL(/\/signin\?next=%2Faccount$/);
	});
});

test.describe('the owner manages helpers', () => {
	test('adds a helper who can open the workshop, then removes them and their session ends', async ({
		page,
		browser
	}) => {
		test.slow(); // two browsers, four sign-ins
		const email = unique('newhelper');
		await signInAs(page, 'owner');
		await page.goto('/workshop/people');
		// No way to remove yourself.
		const me = page.getByTestId('staff-list').getByRole('listitem').filter({ hasText: '(you)' });
		await expect(me.getByRole('button', { name: /remove/i })).toHaveCount(0);

		await page.getByLabel('Name').fill('Moss Newhand');
		await page.getByLabel('E-mail').first().fill(email);
		await page.getByLabel('Temporary password').fill('temporary-pass-1');
		await page.getByRole('button', { name: 'Add helper' }).click();
		await expect(page.getByText('Moss Newhand can now sign in as a helper.')).toBeVisible();
		await expect(page.getByTestId('staff-list')).toContainText(email);

		const helperContext = await browser.newContext();
		const helper = await helperContext.newPage();
		await signInWith(helper, email, 'temporary-pass-1');
		await expect(helper).toHaveURL(/\/workshop$/);

		await page.getByRole('button', { name: 'Remove Moss Newhand as a helper' }).click();
		await expect(page.getByText('Moss Newhand is no longer a helper')).toBeVisible();
		await expect(page.getByTestId('staff-list')).not.toContainText(email);

		// Their open session ended with the removal; signing in again gives a customer account.
		await helper.goto('/workshop');
		await expect(helper).toHaveURL(/\/signin\?next=%2Fworkshop$/);
		await signInWith(helper, email, 'temporary-pass-1');
		await expect(helper).toHaveURL(/\/account$/);
		expect((await helper.goto('/workshop'))?.status()).toBe(403);
		await helperContext.close();
	});

	test('adding a helper over an existing customer points to promotion instead', async ({
		page
	}) => {
		await signInAs(page, 'owner');
		await page.goto('/workshop/people');
		await page.getByLabel('Name').fill('Juniper');
		await page.getByLabel('E-mail').first().fill(demoAccount('customer').email);
		await page.getByLabel('Temporary password').fill('temporary-pass-1');
		await page.getByRole('button', { name: 'Add helper' }).click();
		await expect(page.locator('#add-email-error')).toContainText('already has a customer account');
		await expect(page.getByLabel('Name')).toHaveValue('Juniper');
	});
});

test('API errors answer JSON `{ error }` with the status, also to a browser', async ({
	request
}) => {
	const res = await request.get('/api/no-such-endpoint', { headers: { accept: 'text/html' } });
	expect(res.status()).toBe(404);
	expect(res.headers()['content-type']).toContain('application/json');
	expect(await res.json()).toEqual({ error: expect.any(String) });
});
