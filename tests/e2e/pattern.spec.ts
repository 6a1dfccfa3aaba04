import { readFileSync } from 'node:fs';
import { expect, test, type Download, type Page } from '@playwright/test';
import { PDFDocument } from 'pdf-lib';
import { pdfText } from '../helpers/pdf-text';
import { signInAs } from '../helpers/auth';

/**
 * The rosette engine where people meet it: the buyer's live personaliser, the carver's layout
 * planner with its 1:1 PDF, an order line's template in the workshop, and the public pattern API.
 */

// Page sizes in PostScript points. ISO 216: A4 is 210 × 297 mm; ANSI/ASME Y14.1: US Letter is
// 8.5 × 11 in. ISO 32000-1 (PDF): 1 pt = 1/72 in; 1 in = 25.4 mm exactly (1959 yard and pound
// agreement). So A4 = 595.276 × 841.890 pt, Letter = 612 × 792 pt.
const MM = 72 / 25.4;
const A4 = { w: 210 * MM, h: 297 * MM };
const LETTER = { w: 8.5 * 72, h: 11 * 72 };

/** A refusal from our API: a message and, per field, what is wrong with it. */
interface ApiError {
	error: string;
	fields: Record<string, string[]>;
}

/** The parts of GET /api/pattern's answer these tests read. */
interface PatternAnswer {
	compassRadiusMm: number;
	rosettes: { x: number; y: number; r: number }[];
	chips: { kind: string; areaMm2: number; cutLengthMm: number }[];
	chipCount: number;
	cutLengthMm: number;
	estimateMinutes: number;
	warnings: unknown;
	steps: string[];
	svg: string;
}

async function pdfOf(download: Download) {
	const path = await download.path();
	const bytes = readFileSync(path);
	expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
	return { path, bytes, doc: await PDFDocument.load(bytes) };
}

function expectPageSize(doc: PDFDocument, size: { w: number; h: number }) {
	expect(doc.getPageCount()).toBeGreaterThan(0);
	for (const p of doc.getPages()) {
		const { width, height } = p.getSize();
		expect(width).toBeCloseTo(size.w, 2);
		expect(height).toBeCloseTo(size.h, 2);
	}
}

/** The chip count in the personaliser's caption ("12 chips …"). */
async function shownChips(page: Page) {
	const text = await page.locator('figcaption strong').first().textContent();
	const m = /(\d+) chips/.exec(text ?? '');
	expect(m, `chip count in "${text}"`).not.toBeNull();
	return Number(m![1]);
}

test.describe('personaliser on the shop', () => {
	test('initials redraw in the rosette on every keystroke, in the browser, and halved chips change the count', async ({
		page,
		baseURL
	}) => {
		// The rosette bottle holder is personalisable in the demo seed: one 60 mm rosette.
		await page.goto('/shop/rosette-bottle-holder', { waitUntil: 'networkidle' });
		const preview = page.getByTestId('personaliser-preview');
		const closeUp = preview.locator('svg').first();
		const title = closeUp.locator('title');
		const initialsField = page.getByRole('textbox', { name: 'Initials' });
		await expect(closeUp).toBeVisible();

		// Common practice: a six-petal rosette is 6 petals + 6 chips between them = 12 chips.
		await expect.poll(() => shownChips(page)).toBe(12);

		const requests: string[] = [];
		page.on('request', (r) => {
			if (r.url().startsWith(baseURL!)) requests.push(`${r.method()} ${r.url()}`);
		});

		// Letter by letter: the drawing names the initials it carries after each keystroke.
		for (const typed of ['K', 'KM', 'KMR']) {
			await initialsField.press(typed.at(-1)!);
			await expect(initialsField).toHaveValue(typed);
			await expect(title).toContainText(`initials ${typed}`);
		}

		// The letters are real outlines (a path after the medallion circle), inside the medallion,
		// and the medallion sits at the centre of the rosette's circle.
		const shapes = await closeUp.evaluate((svg) => {
			const circle = svg.querySelector('circle');
			const letters = circle?.nextElementSibling;
			if (!circle || !letters || letters.tagName !== 'path') return null;
			const box = (el: SVGGraphicsElement) => {
				const b = el.getBBox();
				return { x: b.x, y: b.y, width: b.width, height: b.height };
			};
			return {
				m: box(circle),
				l: box(letters as SVGPathElement),
				d: letters.getAttribute('d') ?? ''
			};
		});
		expect(shapes, 'medallion circle followed by the letter outlines').not.toBeNull();
		expect(shapes!.d.length).toBeGreaterThan(100);
		expect(shapes!.l.width).toBeGreaterThan(0);
		expect(shapes!.l.x).toBeGreaterThanOrEqual(shapes!.m.x);
		expect(shapes!.l.y).toBeGreaterThanOrEqual(shapes!.m.y);
		expect(shapes!.l.x + shapes!.l.width).toBeLessThanOrEqual(shapes!.m.x + shapes!.m.width);
		expect(shapes!.l.y + shapes!.l.height).toBeLessThanOrEqual(shapes!.m.y + shapes!.m.height);

		const classicWithInitials = await shownChips(page);
		await page.getByText('Split petals').click();
		await expect.poll(() => shownChips(page)).toBeGreaterThan(classicWithInitials);
		await expect(title).toContainText('initials KMR');

		// Without initials, halved chips: each of the 12 chips split along its axis = 24
		// (common practice for beginners' rosettes).
		await initialsField.fill('');
		await expect(title).not.toContainText('initials');
		await expect.poll(() => shownChips(page)).toBe(24);

		// All of the above was drawn in the page: nothing went to the server.
		expect(requests).toEqual([]);
	});
});

test.describe('layout planner', () => {
	test('owner changes the rosettes, sees counts and steps follow, downloads an A4 template', async ({
		page
	}) => {
		await signInAs(page, 'owner');
		await page.goto('/workshop/layout', { waitUntil: 'networkidle' });
		const chips = page.getByTestId('planner-chips');
		const steps = page.locator('ol li');

		// Defaults: three 70 mm rosettes. Common practice: a 70 mm rosette is drawn with the
		// compass at 35 mm.
		await expect(steps.filter({ hasText: 'Set the compass to 35 mm' })).toHaveCount(1);
		const threeRosettes = Number(await chips.textContent());

		await page.getByLabel('How many').fill('1');
		// Common practice: one rosette, 12 chips.
		await expect(chips).toHaveText('12');
		expect(threeRosettes).toBeGreaterThan(12);
		await expect(steps.filter({ hasText: 'Mark the centre on the centre line' })).toHaveCount(1);

		await page.getByLabel('Rosette diameter (mm)').fill('50');
		await expect(steps.filter({ hasText: 'Set the compass to 25 mm' })).toHaveCount(1);
		await page.getByLabel('Halve every chip').check();
		// Halved chips: 24 a rosette (common practice).
		await expect(chips).toHaveText('24');

		const [download] = await Promise.all([
			page.waitForEvent('download'),
			page.getByRole('button', { name: 'Download for A4' }).click()
		]);
		expect(download.suggestedFilename()).toMatch(/\.pdf$/);
		const { doc } = await pdfOf(download);
		// ISO 216 A4, 210 × 297 mm = 595.276 × 841.890 pt (1 pt = 1/72 in, ISO 32000-1).
		expect(A4.w).toBeCloseTo(595.276, 3);
		expect(A4.h).toBeCloseTo(841.89, 3);
		expectPageSize(doc, A4);
	});
});

test.describe('order line template', () => {
	// CS-1009 in the demo seed: one personalised rosette bottle holder, initials HO, basswood.
	const REF = 'CS-1009';

	test('helper opens the order, sees the carving and downloads its templates', async ({ page }) => {
		await signInAs(page, 'helper');
		await page.goto('/workshop/orders');
		await page.getByRole('link', { name: REF, exact: true }).click();
		await expect(page).toHaveURL(`/workshop/orders/${REF}`);

		await expect(page.getByTestId('order-ref')).toHaveText(`Order ${REF}`);
		await expect(page.getByTestId('buyer-name')).toHaveText('Hattie Okafor');
		await expect(page.getByTestId('buyer-address')).toContainText('7 Tannery Walk');
		await expect(page.getByTestId('order-status')).toHaveAttribute('data-status', 'paid');
		await expect(page.getByTestId('payment-id')).toHaveText('pi_demo_1009');
		const line = page.getByTestId('order-line').first();
		await expect(line.getByTestId('line-initials')).toHaveText('HO');
		const svg = line.getByTestId('line-preview').locator('svg').first();
		await expect(svg.locator('title')).toContainText('initials HO');
		// Server-side letter font: the initials are outlines, not text.
		await expect(svg.locator('circle + path')).toHaveCount(1);
		await expect(svg.locator('text')).toHaveCount(0);

		const [a4] = await Promise.all([
			page.waitForEvent('download'),
			line.getByRole('link', { name: 'A4 PDF' }).click()
		]);
		const a4Pdf = await pdfOf(a4);
		expectPageSize(a4Pdf.doc, A4); // ISO 216 A4
		expect(await pdfText(a4Pdf.bytes)).toContain(`Order ${REF}`);

		const [letter] = await Promise.all([
			page.waitForEvent('download'),
			line.getByRole('link', { name: 'US Letter PDF' }).click()
		]);
		const letterPdf = await pdfOf(letter);
		expectPageSize(letterPdf.doc, LETTER); // 8.5 × 11 in
		expect(await pdfText(letterPdf.bytes)).toContain(REF);
	});

	test('template links refuse what is not there and paper sizes not offered', async ({ page }) => {
		const lineId = async (ref: string, n: number) => {
			await page.goto(`/workshop/orders/${ref}`);
			return page.getByTestId('order-line').nth(n).getAttribute('data-line');
		};
		// Anonymous: sent to sign in.
		const anon = await page.request.get(`/workshop/orders/${REF}/lines/1/template.pdf`, {
			maxRedirects: 0
		});
		expect(anon.status()).toBe(303);
		expect(anon.headers().location).toMatch(/^\/signin\?next=/);

		await signInAs(page, 'helper');
		const id = await lineId(REF, 0);
		const base = `/workshop/orders/${REF}/lines/${id}/template.pdf`;

		const ok = await page.request.get(base);
		expect(ok.status()).toBe(200);
		expect(ok.headers()['content-type']).toBe('application/pdf');
		expectPageSize(await PDFDocument.load(await ok.body()), A4); // no paper given: A4

		const bad = await page.request.get(`${base}?paper=a3`);
		expect(bad.status()).toBe(400);
		expect(((await bad.json()) as ApiError).fields.paper[0]).toMatch(/a4 or letter/i);

		expect(
			(await page.request.get(`/workshop/orders/CS-9999/lines/${id}/template.pdf`)).status()
		).toBe(404);
		expect(
			(await page.request.get(`/workshop/orders/${REF}/lines/abc/template.pdf`)).status()
		).toBe(404);
		// A line of another order is not found under this one.
		const otherLine = await lineId('CS-1001', 0);
		expect(
			(await page.request.get(`/workshop/orders/${REF}/lines/${otherLine}/template.pdf`)).status()
		).toBe(404);
		// CS-1006's second line is a ready-made coffee scoop: no template.
		const scoop = await lineId('CS-1006', 1);
		const notPersonal = await page.request.get(
			`/workshop/orders/CS-1006/lines/${scoop}/template.pdf`
		);
		expect(notPersonal.status()).toBe(404);
		expect(((await notPersonal.json()) as ApiError).error).toMatch(/not personalised/);
		// An unknown order page is a 404 too.
		expect((await page.goto('/workshop/orders/CS-9999'))!.status()).toBe(404);
	});
});

test.describe('pattern API', () => {
	test('GET /api/pattern answers with the layout', async ({ request }) => {
		const res = await request.get(
			'/api/pattern?diameter=70&count=3&width=100&length=300&initials=ab&wood=cherry'
		);
		expect(res.status()).toBe(200);
		const body = (await res.json()) as PatternAnswer;
		// Common practice: a 70 mm rosette is drawn with the compass at 35 mm.
		expect(body.compassRadiusMm).toBe(35);
		expect(body.rosettes).toHaveLength(3);
		for (const r of body.rosettes) {
			expect(Object.keys(r).sort()).toEqual(['r', 'x', 'y']);
			expect(r.r).toBe(35);
		}
		// Common practice: three rosettes spaced by the radius span 140 mm on the centre line.
		const ys = body.rosettes.map((r: { y: number }) => r.y);
		expect(Math.max(...ys) + 35 - (Math.min(...ys) - 35)).toBeCloseTo(140, 9);
		expect(body.chips.length).toBeGreaterThan(0);
		for (const c of body.chips) {
			expect([
				'petal',
				'between',
				'half-petal',
				'half-between',
				'part',
				'triangle',
				'letter'
			]).toContain(c.kind);
			expect(c.areaMm2).toBeGreaterThan(0);
			expect(c.cutLengthMm).toBeGreaterThan(0);
		}
		expect(body.chipCount).toBe(
			body.chips.filter((c: { kind: string }) => c.kind !== 'letter').length
		);
		expect(body.chips.filter((c: { kind: string }) => c.kind === 'letter')).toHaveLength(2);
		expect(body.cutLengthMm).toBeGreaterThan(0);
		expect(body.estimateMinutes).toBeGreaterThan(0);
		expect(Array.isArray(body.warnings)).toBe(true);
		expect(body.steps.some((s: string) => s.includes('Set the compass to 35 mm'))).toBe(true);
		expect(body.svg).toMatch(/^<svg[^>]*xmlns="http:\/\/www\.w3\.org\/2000\/svg"/);
		expect(body.svg).toContain('initials AB');
	});

	test('GET /api/pattern refuses bad settings field by field', async ({ request }) => {
		const res = await request.get(
			'/api/pattern?diameter=abc&count=0&width=10&initials=A1&wood=oak-ish'
		);
		expect(res.status()).toBe(400);
		const body = (await res.json()) as ApiError;
		expect(typeof body.error).toBe('string');
		expect(body.fields.diameter[0]).toMatch(/number of millimetres/);
		expect(body.fields.count[0]).toMatch(/at least one/i);
		expect(body.fields.width[0]).toMatch(/at least 20 mm/);
		expect(body.fields.length[0]).toMatch(/^Length .*millimetres/);
		expect(body.fields.initials[0]).toMatch(/1 to 3 letters/);
		expect(body.fields.wood[0]).toMatch(/our woods/);
	});
});
