import { expect, test, type APIResponse, type Page } from '@playwright/test';
import { signInAs } from '../../helpers/auth';

/**
 * The workshop's forms refused the way people get them wrong (WALKS.md): sent empty, far too
 * long, or with characters no form should take (a NUL, a right-to-left override, markup). Each
 * refusal stays on its page with its sentence (a 4xx, never an error page), and nothing is
 * half-written. Posted without JavaScript first (the page answers itself), then a few walked with
 * it, where the answer shows beside the field or in the form's alert.
 */
test.describe.configure({ timeout: 180_000 });

const LONG = 'x'.repeat(5000);
const BAD = 'a\u0000b\u202e<script>alert(1)</script>';

/** A page, not the framework's or the workshop's error page. */
function expectPage(res: APIResponse, html: string, heading: RegExp) {
	expect(res.status(), html.slice(0, 300)).toBeGreaterThanOrEqual(400);
	expect(res.status()).toBeLessThan(500);
	expect(html).not.toMatch(/>Error \d{3}</);
	expect(html).not.toMatch(/Something went wrong|That did not work/);
	expect(html).toMatch(heading);
}

/** Posts a form the way a browser without JavaScript does, as the signed-in person. */
async function post(page: Page, url: string, fields: [string, string][]) {
	const body = new URLSearchParams(fields).toString();
	const origin = new URL(page.url()).origin;
	const res = await page.request.post(url, {
		headers: { 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html', origin },
		data: body,
		maxRedirects: 0
	});
	return { res, html: await res.text() };
}

/** Empty, far too long, bad characters: each field of the form given each. */
function badBodies(fields: string[], fixed: [string, string][] = []): [string, string][][] {
	return [
		[...fixed],
		[...fixed, ...fields.map((f) => [f, ''] as [string, string])],
		[...fixed, ...fields.map((f) => [f, LONG] as [string, string])],
		[...fixed, ...fields.map((f) => [f, BAD] as [string, string])]
	];
}

async function firstOrderRef(page: Page) {
	await page.goto('/workshop/orders');
	const row = page.locator('tr[data-ref]').first();
	await expect(row).toBeVisible();
	return (await row.getAttribute('data-ref'))!;
}

async function firstLink(page: Page, list: string, pattern: RegExp) {
	await page.goto(list);
	const hrefs = await page
		.locator('main a[href]')
		.evaluateAll((as) => as.map((a) => a.getAttribute('href') ?? ''));
	const href = hrefs.find((h) => pattern.test(h));
	expect(href, `a link like ${pattern} on ${list}`).toBeTruthy();
	return href!;
}

test('the order page’s forms refuse bad input on the page, and the order is unchanged', async ({
	page
}) => {
	await signInAs(page, 'owner');
	const ref = await firstOrderRef(page);
	const url = `/workshop/orders/${ref}`;
	await page.goto(url);
	const refShown = await page.getByTestId('order-ref').textContent();
	const heading = new RegExp(`Order ${ref}`);
	const forms: [string, string[], [string, string][]][] = [
		['refund', ['kind', 'amount', 'reason', 'restock'], []],
		['cancel', ['reason', 'expect'], []],
		['back', ['reason', 'expect'], []],
		['ship', ['carrier', 'trackingNumber', 'trackingUrl', 'note'], []],
		['note', ['body'], []],
		['balance', ['method'], []],
		['move', ['to', 'why', 'expect'], []]
	];
	for (const [action, fields, fixed] of forms) {
		for (const body of badBodies(fields, fixed)) {
			const { res, html } = await post(page, `${url}?/${action}`, body);
			await test.step(`${action} ${JSON.stringify(body).slice(0, 80)}`, () =>
				expectPage(res, html, heading));
		}
	}
	// Nothing half-written: the order and its history are as they were.
	await page.goto(url);
	await expect(page.getByTestId('order-ref')).toHaveText(refShown!);
	await expect(page.getByText(LONG.slice(0, 200))).toHaveCount(0);
	await expect(page.getByText('<script>')).toHaveCount(0);

	// With JavaScript: an empty note and a far too long one are answered beside the field.
	const note = page.locator('form[action="?/note"]');
	await note.getByRole('button').click();
	await expect(page.getByText('Write the note first.')).toBeVisible();
	await note.locator('[name="body"]').fill(LONG);
	await note.getByRole('button').click();
	await expect(page.getByText('Keep a note under 2,000 characters.')).toBeVisible();
	await note.locator('[name="body"]').fill('Box \u202edetned');
	await note.getByRole('button').click();
	await expect(
		page.getByText(/Remove the hidden control or text-direction characters/)
	).toBeVisible();
	await expect(page.getByText(/^Error \d{3}$/)).toHaveCount(0);
	await expect(page).toHaveURL(new RegExp(`${url}$`));
});

test('the orders table’s bulk move refuses bad input on its page', async ({ page }) => {
	await signInAs(page, 'owner');
	for (const body of [
		[],
		[['to', 'carving']],
		[
			['refs', ''],
			['to', '']
		],
		[
			['refs', LONG],
			['to', 'carving']
		],
		[
			['refs', BAD],
			['to', BAD]
		],
		[
			['refs', 'CS-AAAAAA'],
			['to', 'refunded']
		]
	] as [string, string][][]) {
		const { res, html } = await post(page, '/workshop/orders?/move', body);
		expectPage(res, html, /Orders/);
	}
});

test('the piece’s stock panel refuses bad input beside its fields, nothing counted', async ({
	page
}) => {
	await signInAs(page, 'owner');
	const href = await firstLink(page, '/workshop/pieces', /^\/workshop\/pieces\/\d+$/);
	await page.goto(href);
	const table = await page.getByTestId('stock-table').textContent();
	for (const body of badBodies(['woodId', 'place', 'direction', 'count', 'reason'])) {
		const { res, html } = await post(page, `${href}?/stock`, body);
		expectPage(res, html, /Stock/);
	}
	await page.goto(href);
	await expect(page.getByTestId('stock-table')).toHaveText(table!);

	// With JavaScript: a count of letters and an empty reason, answered beside the fields.
	await page.locator('#stock-count').fill('lots');
	await page.locator('#stock-reason').fill('');
	await page.getByRole('button', { name: 'Save the change' }).click();
	await expect(page.locator('#stock-count')).toHaveAttribute('aria-invalid', 'true');
	await expect(page.getByText(/^Error \d{3}$/)).toHaveCount(0);
	await expect(page.getByTestId('stock-table')).toHaveText(table!);
});

test('the fair page’s and the tally page’s forms refuse bad input on their pages', async ({
	page
}) => {
	await signInAs(page, 'owner');
	const href = await firstLink(page, '/workshop/fairs', /^\/workshop\/fairs\/\d+$/);
	for (const body of [[['helper', 'no-such-person']], [['helper', LONG]], [['helper', BAD]]] as [
		string,
		string
	][][]) {
		const { res, html } = await post(page, `${href}?/helpers`, body);
		expectPage(res, html, /Helpers|helper/);
	}
	for (const body of [
		[['take-1-1', 'abc']],
		[['take-1-1', LONG]],
		[['take-1-1', BAD]],
		[['take-1-1', '-3']]
	] as [string, string][][]) {
		const { res, html } = await post(page, `${href}?/loadOut`, body);
		expectPage(res, html, /Load out|load out/i);
	}
	for (const body of badBodies(['name', 'place', 'startsOn', 'endsOn', 'boothFee'])) {
		const { res, html } = await post(page, `${href}?/save`, body);
		expectPage(res, html, /Fair|fair/);
	}
	const tally = `${href}/tally`;
	await page.goto(tally);
	const fields = await page
		.locator('form[action="?/counts"] [name]')
		.evaluateAll((els) => [...new Set(els.map((e) => e.getAttribute('name') ?? ''))]);
	for (const body of badBodies(fields.filter((f) => f && f !== 'day' && f !== 'saveId')).slice(2)) {
		const { res, html } = await post(page, `${tally}?/counts`, body);
		expectPage(res, html, /Tally|tally|count/i);
	}
	const { res, html } = await post(page, `${tally}?/close`, [['confirm', BAD]]);
	expectPage(res, html, /Tally|tally|count/i);
});

test('the layout planner answers bad numbers with its page, not an error', async ({ page }) => {
	await signInAs(page, 'owner');
	await page.goto('/workshop/layout');
	const names = await page
		.locator('form [name]')
		.evaluateAll((els) => [...new Set(els.map((e) => e.getAttribute('name') ?? ''))]);
	// Far too long, yet inside the server's limit on an address (8,000 characters in all).
	for (const v of ['', 'x'.repeat(300), BAD, '-5', '1e9']) {
		const qs = new URLSearchParams(names.filter(Boolean).map((n) => [n, v])).toString();
		const res = await page.request.get(`/workshop/layout/template.pdf?${qs}`, { maxRedirects: 0 });
		expect(res.status(), `template.pdf with ${v.slice(0, 20)}`).toBeLessThan(500);
		await page.goto(`/workshop/layout?${qs}`);
		await expect(page.getByRole('heading', { name: 'Layout planner' })).toBeVisible();
		await expect(page.getByText(/^Error \d{3}$/)).toHaveCount(0);
	}
});

test('on a phone the stock panel’s refusal is where the eye is, nothing counted', async ({
	page
}) => {
	await page.setViewportSize({ width: 390, height: 844 });
	await signInAs(page, 'owner');
	const href = await firstLink(page, '/workshop/pieces', /^\/workshop\/pieces\/\d+$/);
	await page.goto(href);
	const table = await page.getByTestId('stock-table').textContent();
	await page.locator('#stock-count').fill('-');
	await page.getByRole('button', { name: 'Save the change' }).click();
	await expect(page.locator('#stock-count')).toHaveAttribute('aria-invalid', 'true');
	await expect(page.locator('#stock-count')).toBeInViewport();
	await expect(page.getByTestId('stock-table')).toHaveText(table!);
});
