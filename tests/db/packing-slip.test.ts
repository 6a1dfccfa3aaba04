/**
 * Packing and gift slips against outside readers: pdfjs-dist parses the PDF (page size, text),
 * its QR image is pulled out through pdfjs, turned into RGBA pixels by sharp and decoded by
 * jsQR. Runs against the seeded test database (demo orders CS-1001…).
 */
import sharp from 'sharp';
import jsQR from 'jsqr';
import { getDocument, OPS } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { describe, expect, it } from 'vitest';
import { GET as packingSlip } from '../../src/routes/workshop/orders/[ref]/packing-slip.pdf/+server';
import { GET as giftSlip } from '../../src/routes/workshop/orders/[ref]/gift-slip.pdf/+server';
import { GET as batch } from '../../src/routes/workshop/orders/packing-slips.pdf/+server';
import { slipOrders, slipShop } from '$lib/server/pdf/slip-data';
import { config } from '$lib/server/config';

const fontDir = new URL('../../node_modules/pdfjs-dist/standard_fonts/', import.meta.url).pathname;

type Role = 'owner' | 'helper' | 'customer';
const event = (path: string, role: Role | null, params: Record<string, string> = {}) =>
	({
		url: new URL(`http://localhost${path}`),
		params,
		locals: { user: role ? { id: 'u', role, name: 'T', email: 't@x' } : null }
	}) as never;

async function call(h: (e: never) => unknown, e: never): Promise<Response> {
	try {
		return (await h(e)) as Response;
	} catch (thrown) {
		// SvelteKit's error() throws an HttpError with a status.
		const s = (thrown as { status?: number }).status;
		if (s) return new Response(null, { status: s });
		throw thrown;
	}
}

async function parse(res: Response) {
	expect(res.status).toBe(200);
	expect(res.headers.get('content-type')).toBe('application/pdf');
	const data = new Uint8Array(await res.arrayBuffer());
	return getDocument({ data, standardFontDataUrl: fontDir, isEvalSupported: false }).promise;
}

async function pageText(doc: Awaited<ReturnType<typeof parse>>, n: number) {
	const page = await doc.getPage(n);
	const content = await page.getTextContent();
	return content.items.map((i) => ('str' in i ? i.str : '')).join(' ');
}

/** The first image painted on the page, decoded by pdfjs, as RGBA pixels through sharp. */
async function firstImageRgba(doc: Awaited<ReturnType<typeof parse>>, n: number) {
	const page = await doc.getPage(n);
	const ops = await page.getOperatorList();
	const at = ops.fnArray.indexOf(OPS.paintImageXObject);
	expect(at).toBeGreaterThanOrEqual(0);
	const name = (ops.argsArray[at] as unknown[])[0] as string;
	const img = await new Promise<{ width: number; height: number; data: Uint8ClampedArray }>((r) => {
		page.objs.get(name, r);
	});
	const channels = img.data.length / (img.width * img.height);
	expect([3, 4]).toContain(channels);
	const { data, info } = await sharp(Buffer.from(img.data), {
		raw: { width: img.width, height: img.height, channels: channels as 3 | 4 }
	})
		.ensureAlpha()
		.raw()
		.toBuffer({ resolveWithObject: true });
	return { data: new Uint8ClampedArray(data), width: info.width, height: info.height };
}

describe('packing slip PDF', () => {
	// ISO 216 A4 is 210 × 297 mm = 595.28 × 841.89 pt; US Letter 8.5 × 11 in = 612 × 792 pt;
	// a 4 × 6 in label = 288 × 432 pt (1 pt = 1/72 in, ISO 32000-1 §8.3.2.3).
	const sizes = { a4: [595.28, 841.89], letter: [612, 792], label: [288, 432] } as const;

	for (const [paper, [w, h]] of Object.entries(sizes)) {
		it(`on ${paper} has the stated page size, the reference and both addresses`, async () => {
			const doc = await parse(
				await call(
					packingSlip,
					event(`/workshop/orders/CS-1002/packing-slip.pdf?paper=${paper}`, 'helper', {
						ref: 'CS-1002'
					})
				)
			);
			const page = await doc.getPage(1);
			const [x0, y0, x1, y1] = page.view;
			expect(x1 - x0).toBeCloseTo(w, 1);
			expect(y1 - y0).toBeCloseTo(h, 1);
			const text = (
				await Promise.all(Array.from({ length: doc.numPages }, (_, i) => pageText(doc, i + 1)))
			).join(' ');
			expect(text).toContain('CS-1002');
			// Buyer's address as seeded, and the shop's return address from settings.
			expect(text).toContain('3 Quarry Lane');
			expect(text).toContain('Hatchley, NH 03101');
			const shop = await slipShop();
			expect(shop.address.length).toBeGreaterThan(2);
			for (const line of shop.address.slice(1, 3)) expect(text).toContain(line);
			expect(text).toContain('Happy birthday, Dad.');
			expect(text).toMatch(/initials "TR"/);
			expect(text).toMatch(/\$\d+\.\d\d/);
		});
	}

	it('carries a QR code that a general QR reader (jsQR) decodes to the order page', async () => {
		const doc = await parse(
			await call(
				packingSlip,
				event('/workshop/orders/CS-1002/packing-slip.pdf', 'owner', { ref: 'CS-1002' })
			)
		);
		const img = await firstImageRgba(doc, 1);
		const code = jsQR(img.data, img.width, img.height);
		expect(code).not.toBeNull();
		expect(code!.data).toBe(`${config.origin}/workshop/orders/CS-1002`);
		expect(code!.data.split('/').pop()).toBe('CS-1002');
	});

	it('the gift slip prints the note and no prices', async () => {
		const doc = await parse(
			await call(
				giftSlip,
				event('/workshop/orders/CS-1002/gift-slip.pdf?paper=label', 'helper', { ref: 'CS-1002' })
			)
		);
		const text = await pageText(doc, 1);
		expect(text).toContain('Gift slip');
		expect(text).toContain('Happy birthday, Dad.');
		expect(text).toContain('CS-1002');
		expect(text).not.toMatch(/\$\s?\d/);
		expect(text).not.toMatch(/Total|Subtotal/);
	});

	it("the gift slip's QR opens the public care page, not the signed-in workshop", async () => {
		const doc = await parse(
			await call(
				giftSlip,
				event('/workshop/orders/CS-1002/gift-slip.pdf?paper=a4', 'owner', { ref: 'CS-1002' })
			)
		);
		const img = await firstImageRgba(doc, 1);
		const code = jsQR(img.data, img.width, img.height);
		expect(code?.data).toBe(`${config.origin}/care`);
		expect(code?.data).not.toContain('/workshop');
	});

	it('prints the batch on US Letter and on the 4 × 6 label too', async () => {
		// US Letter 8.5 × 11 in = 612 × 792 pt; 4 × 6 in = 288 × 432 pt (72 pt per inch).
		for (const [paper, w, h] of [
			['letter', 612, 792],
			['label', 288, 432]
		] as const) {
			const doc = await parse(
				await call(
					batch,
					event(`/workshop/orders/packing-slips.pdf?refs=CS-1001,CS-1002&paper=${paper}`, 'owner')
				)
			);
			for (let n = 1; n <= doc.numPages; n++) {
				const [x0, y0, x1, y1] = (await doc.getPage(n)).view;
				expect(x1 - x0).toBeCloseTo(w, 1);
				expect(y1 - y0).toBeCloseTo(h, 1);
			}
			const all = (
				await Promise.all(Array.from({ length: doc.numPages }, (_, i) => pageText(doc, i + 1)))
			).join(' ');
			expect(all).toContain('CS-1001');
			expect(all).toContain('CS-1002');
		}
	});

	it('the batch holds one slip per order, in the order asked, each with its QR', async () => {
		const refs = ['CS-1003', 'CS-1001', 'CS-1002'];
		const doc = await parse(
			await call(batch, event(`/workshop/orders/packing-slips.pdf?refs=${refs.join(',')}`, 'owner'))
		);
		const { found } = await slipOrders(refs);
		const seen: string[] = [];
		for (let n = 1; n <= doc.numPages; n++) {
			const text = await pageText(doc, n);
			const m = text.match(/Order (CS-\d+)/);
			if (m) seen.push(m[1]);
		}
		expect(seen).toEqual(refs);
		expect(found.map((o) => o.ref)).toEqual(refs);
		const first = await firstImageRgba(doc, 1);
		expect(jsQR(first.data, first.width, first.height)?.data).toMatch(/\/CS-1003$/);
	});

	it('refuses bad input with a clear message and keeps customers out', async () => {
		const bad = await call(
			packingSlip,
			event('/workshop/orders/CS-1002/packing-slip.pdf?paper=a3', 'owner', { ref: 'CS-1002' })
		);
		expect(bad.status).toBe(400);
		expect(((await bad.json()) as { error: string }).error).toMatch(/a4, letter or label/);

		const missing = await call(
			batch,
			event('/workshop/orders/packing-slips.pdf?refs=CS-1001,CS-NOPE99', 'owner')
		);
		expect(missing.status).toBe(404);
		expect(((await missing.json()) as { error: string }).error).toContain('CS-NOPE99');

		const none = await call(batch, event('/workshop/orders/packing-slips.pdf?refs=', 'owner'));
		expect(none.status).toBe(400);

		const customer = await call(
			packingSlip,
			event('/workshop/orders/CS-1002/packing-slip.pdf', 'customer', { ref: 'CS-1002' })
		);
		expect(customer.status).toBe(403);
	});
});
