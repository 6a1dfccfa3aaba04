/**
 * Foundation: the public pages answer, every request a page makes stays on our own origin, the
 * built client holds no outside URL, and the Nunito font is served by the app itself.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { expect, test } from '@playwright/test';

const buildDir = process.env.CHIPSTALL_BUILD_DIR || 'build';

function filesUnder(dir: string): string[] {
	return readdirSync(dir).flatMap((f) => {
		const p = path.join(dir, f);
		return statSync(p).isDirectory() ? filesUnder(p) : [p];
	});
}

/** XML namespace names are identifiers, not addresses: the browser never fetches them. */
const NAMESPACES =
	/^https?:\/\/www\.w3\.org\/(2000\/svg|1999\/xhtml|1999\/xlink|1998\/Math\/MathML|XML\/1998\/namespace|2000\/xmlns\/?)$/;
/**
 * JSON Schema dialect ids (`$schema`) are identifiers too: zod, which the owner's layout planner
 * runs in the browser to check its fields, carries them for its schema export and never fetches them.
 */
const SCHEMA_DIALECTS =
	/^https?:\/\/json-schema\.org\/(draft[-/][\w-]+\/schema#?|draft\/\d{4}-\d{2}\/schema)$/;
const LOOPBACK = /^https?:\/\/(localhost|127\.0\.0\.1)([:/]|$)/;
/** Svelte's production error messages end in a link to the error's explanation: text, never fetched. */
const SVELTE_ERROR_TEXT = /^https:\/\/svelte\.dev\/e\//;
/** A scheme with no host name after it (`http://[${host}]` built at run time) addresses nothing. */
const NO_HOST = /^https?:\/\/(\[?\$\{|$)/;

function outsideUrls(text: string): string[] {
	// `/*! … */` comments are licence banners (kept as the licences ask), not requests.
	const code = text.replace(/\/\*![\s\S]*?\*\//g, '');
	return (code.match(/https?:\/\/[^\s"'`)<>\\]+/g) ?? []).filter(
		(u) =>
			!NAMESPACES.test(u) &&
			!SCHEMA_DIALECTS.test(u) &&
			!LOOPBACK.test(u) &&
			!SVELTE_ERROR_TEXT.test(u) &&
			!NO_HOST.test(u)
	);
}

for (const route of ['/', '/shop']) {
	test(`${route} answers 200 and loads nothing from another host`, async ({ page, baseURL }) => {
		const origin = new URL(baseURL!).origin;
		const foreign: string[] = [];
		page.on('request', (r) => {
			const u = new URL(r.url());
			if (u.protocol.startsWith('http') && u.origin !== origin) foreign.push(r.url());
		});
		const res = await page.goto(route);
		expect(res?.status()).toBe(200);
		await page.waitForLoadState('networkidle');
		expect(foreign).toEqual([]);
		expect(outsideUrls(await page.content())).toEqual([]);
	});
}

test('the built client holds no outside URL', () => {
	const files = filesUnder(path.join(buildDir, 'client')).filter((f) =>
		/\.(js|css|html|json|webmanifest|svg)$/.test(f)
	);
	expect(files.length).toBeGreaterThan(0);
	const found = files.flatMap((f) =>
		outsideUrls(readFileSync(f, 'utf8')).map((u) => `${path.basename(f)}: ${u}`)
	);
	expect(found).toEqual([]);
});

test('Nunito comes from the app as woff2', async ({ page, baseURL }) => {
	const fonts: { url: string; status: number; type: string }[] = [];
	page.on('response', (r) => {
		if (/\.woff2(\?|$)/.test(r.url()))
			fonts.push({ url: r.url(), status: r.status(), type: r.headers()['content-type'] ?? '' });
	});
	await page.goto('/');
	await page.evaluate(() => document.fonts.ready);
	await page.waitForLoadState('networkidle');
	const nunito = fonts.filter((f) => /nunito/i.test(f.url));
	expect(nunito.length).toBeGreaterThan(0);
	for (const f of nunito) {
		expect(new URL(f.url).origin).toBe(new URL(baseURL!).origin);
		expect(new URL(f.url).pathname).toMatch(/^\/_app\/immutable\/assets\/.+\.woff2$/);
		expect(f.status).toBe(200);
	}
	// The body text really renders in Nunito, not a fallback.
	const family = await page.evaluate(() => getComputedStyle(document.body).fontFamily);
	expect(family).toMatch(/Nunito/i);
	expect(await page.evaluate(() => document.fonts.check('16px Nunito'))).toBe(true);
});
