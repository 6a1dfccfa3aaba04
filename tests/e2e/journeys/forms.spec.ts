import { expect, test, type Page } from '@playwright/test';
import net from 'node:net';
import { randomBytes } from 'node:crypto';
import sharp from 'sharp';
import { signInAs } from '../helpers/auth';

/**
 * Forms, bodies and messages walked the way people use them (../shared WALKS.md): every refusal
 * stays on its page with its sentence, a phone photo of several MB uploads with its progress, a
 * refused file says why, a double click records once, and on a phone the answer to a tap is
 * where the eye is.
 */
test.describe.configure({ timeout: 120_000 });

const PIECE = '/shop/rosette-bottle-holder';

/** No framework error page: the page the person was on, with its own heading. */
async function expectNoErrorPage(page: Page) {
	await expect(page.getByText(/^Error \d{3}$/)).toHaveCount(0);
	await expect(
		page.getByRole('heading', { name: /Something went wrong|That did not work/ })
	).toHaveCount(0);
}

/** One raw HTTP/1.1 exchange after another on a single TCP connection. */
class RawConnection {
	private socket: net.Socket;
	private buffer = Buffer.alloc(0);
	private waiting: (() => void) | null = null;
	closed = false;

	constructor(port: number) {
		this.socket = net.connect(port, '127.0.0.1');
		this.socket.on('data', (d) => {
			this.buffer = Buffer.concat([this.buffer, d]);
			this.waiting?.();
		});
		this.socket.on('close', () => {
			this.closed = true;
			this.waiting?.();
		});
		this.socket.on('error', () => {});
	}

	ready() {
		return new Promise<void>((r) => this.socket.once('connect', () => r()));
	}

	write(data: string | Buffer) {
		return new Promise<void>((resolve, reject) =>
			this.socket.write(data, (err) => (err ? reject(err) : resolve()))
		);
	}

	/** Reads one response with a Content-Length body. */
	async response(): Promise<{ status: number; headers: Record<string, string>; body: string }> {
		for (;;) {
			const end = this.buffer.indexOf('\r\n\r\n');
			if (end >= 0) {
				const head = this.buffer.subarray(0, end).toString('latin1').split('\r\n');
				const headers: Record<string, string> = {};
				for (const line of head.slice(1)) {
					const i = line.indexOf(':');
					headers[line.slice(0, i).trim().toLowerCase()] = line.slice(i + 1).trim();
				}
				const length = Number(headers['content-length'] ?? 0);
				if (this.buffer.length >= end + 4 + length) {
					const body = this.buffer.subarray(end + 4, end + 4 + length).toString('utf8');
					this.buffer = this.buffer.subarray(end + 4 + length);
					return { status: Number(head[0].split(' ')[1]), headers, body };
				}
			}
			if (this.closed) throw new Error('the connection closed before a whole response');
			await new Promise<void>((r) => (this.waiting = r));
			this.waiting = null;
		}
	}

	end() {
		this.socket.destroy();
	}
}

function appPort(baseURL: string | undefined) {
	return Number(new URL(baseURL!).port);
}

test.describe('bodies: each kind has its own cap, and an early answer leaves the connection usable', () => {
	test('an oversized JSON body, then a page, on one keep-alive connection', async ({ baseURL }) => {
		const host = new URL(baseURL!).host;
		const conn = new RawConnection(appPort(baseURL));
		await conn.ready();
		const body = JSON.stringify({ slug: 'x'.repeat(200 * 1024) });
		await conn.write(
			`POST /api/cart HTTP/1.1\r\nHost: ${host}\r\nContent-Type: application/json\r\n` +
				`Content-Length: ${Buffer.byteLength(body)}\r\nConnection: keep-alive\r\n\r\n`
		);
		await conn.write(body);
		const first = await conn.response();
		expect(first.status).toBe(413);
		expect(JSON.parse(first.body).error).toMatch(/at most 64 KB of JSON/);
		// RFC 9112 §9.3: a persistent connection carries the next request unless either side said close.
		if (first.headers.connection?.toLowerCase() !== 'close') {
			await conn.write(`GET /api/pattern HTTP/1.1\r\nHost: ${host}\r\n\r\n`);
			const second = await conn.response();
			expect(second.status).toBeLessThan(500);
			expect(second.status).not.toBe(413);
		} else {
			await expect.poll(() => conn.closed).toBe(true);
		}
		conn.end();
	});

	test('a 13 MB multipart photo gets the page’s 413, and the next request on the connection works', async ({
		baseURL
	}) => {
		const host = new URL(baseURL!).host;
		const conn = new RawConnection(appPort(baseURL));
		await conn.ready();
		const boundary = 'journeyboundary';
		const head = Buffer.from(
			`--${boundary}\r\nContent-Disposition: form-data; name="pieceId"\r\n\r\n1\r\n` +
				`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big.jpg"\r\n` +
				'Content-Type: image/jpeg\r\n\r\n'
		);
		const tail = Buffer.from(`\r\n--${boundary}--\r\n`);
		const file = randomBytes(13 * 1024 * 1024);
		const length = head.length + file.length + tail.length;
		await conn.write(
			`POST /api/uploads HTTP/1.1\r\nHost: ${host}\r\nOrigin: ${baseURL}\r\n` +
				`Content-Type: multipart/form-data; boundary=${boundary}\r\nContent-Length: ${length}\r\n\r\n`
		);
		await conn.write(Buffer.concat([head, file, tail]));
		const first = await conn.response();
		expect(first.status).toBe(413);
		expect(JSON.parse(first.body).error).toMatch(/at most 12 MB/);
		expect(first.headers.connection?.toLowerCase()).not.toBe('close');
		await conn.write(`GET /api/pattern HTTP/1.1\r\nHost: ${host}\r\n\r\n`);
		const second = await conn.response();
		expect(second.status).toBe(400); // the pattern API's own answer to no parameters
		conn.end();
	});

	test('a body declaring more than the server will read is answered at once with Connection: close', async ({
		baseURL
	}) => {
		const host = new URL(baseURL!).host;
		const conn = new RawConnection(appPort(baseURL));
		await conn.ready();
		await conn.write(
			`POST /api/uploads HTTP/1.1\r\nHost: ${host}\r\nOrigin: ${baseURL}\r\n` +
				`Content-Type: multipart/form-data; boundary=x\r\nContent-Length: ${200 * 1024 * 1024}\r\n\r\n`
		);
		const first = await conn.response();
		expect(first.status).toBe(413);
		expect(first.headers.connection?.toLowerCase()).toBe('close');
		await expect.poll(() => conn.closed).toBe(true);
		conn.end();
	});

	test('an unauthenticated upload is refused without leaving its body on the connection', async ({
		baseURL
	}) => {
		const host = new URL(baseURL!).host;
		const conn = new RawConnection(appPort(baseURL));
		await conn.ready();
		const body = `--b\r\nContent-Disposition: form-data; name="file"; filename="a.jpg"\r\nContent-Type: image/jpeg\r\n\r\n${'x'.repeat(300_000)}\r\n--b--\r\n`;
		await conn.write(
			`POST /api/uploads HTTP/1.1\r\nHost: ${host}\r\nOrigin: ${baseURL}\r\n` +
				`Content-Type: multipart/form-data; boundary=b\r\nContent-Length: ${Buffer.byteLength(body)}\r\n\r\n${body}`
		);
		const first = await conn.response();
		expect(first.status).toBe(401);
		await conn.write(`GET /api/pattern HTTP/1.1\r\nHost: ${host}\r\n\r\n`);
		expect((await conn.response()).status).toBe(400);
		conn.end();
	});

	test('the booth sync takes a 50-sale chunk of 25 lines each (past 64 KB), refusing only past 2 MB', async ({
		page
	}) => {
		await signInAs(page, 'owner');
		const sale = (i: number) => ({
			id: `journey-${i}-${'0'.repeat(20)}`,
			at: new Date().toISOString(),
			lines: Array.from({ length: 25 }, () => ({
				pieceSlug: 'rosette-bottle-holder',
				woodSlug: 'basswood',
				quantity: 1
			})),
			method: 'cash'
		});
		const sales = Array.from({ length: 50 }, (_, i) => sale(i));
		const body = JSON.stringify({ sales });
		expect(Buffer.byteLength(body)).toBeGreaterThan(64 * 1024);
		// No fair 999999: the route reads the whole body and then says so, storing nothing.
		const fits = await page.request.post('/api/booth/999999/sales', {
			headers: { 'content-type': 'application/json' },
			data: body
		});
		expect(fits.status()).toBe(404);
		expect((await fits.json()).error).toMatch(/no such fair/);
		const tooBig = await page.request.post('/api/booth/999999/sales', {
			headers: { 'content-type': 'application/json' },
			data: JSON.stringify({ sales: [], pad: 'x'.repeat(2_100_000) })
		});
		expect(tooBig.status()).toBe(413);
		expect((await tooBig.json()).error).toMatch(/at most 2 MB/);
	});
});

test.describe('the personaliser', () => {
	test('empty initials: the page stays, with its sentence beside the box', async ({ page }) => {
		await page.goto(PIECE, { waitUntil: 'networkidle' });
		const section = page.getByRole('region', { name: 'Carved with your initials' });
		await section.getByRole('button', { name: 'Add to basket with these initials' }).click();
		await expect(section.getByText('Type one to three letters for the rosette.')).toBeVisible();
		await expectNoErrorPage(page);
		await expect(page.getByRole('heading', { level: 1 })).toHaveText('Rosette bottle holder');
	});

	test('a fourth letter is not dropped without a word', async ({ page }) => {
		await page.goto(PIECE, { waitUntil: 'networkidle' });
		const section = page.getByRole('region', { name: 'Carved with your initials' });
		const box = section.getByRole('textbox', { name: 'Initials' });
		await box.pressSequentially('ABCD');
		await expect(section.getByText(/three letters at most/i)).toBeVisible();
		await expect(box).toHaveAttribute('aria-invalid', 'true');
		await section.getByRole('button', { name: 'Add to basket with these initials' }).click();
		await expect(section.getByText(/three letters at most/i).first()).toBeVisible();
		await expect(page.getByTestId('added-notice')).toHaveCount(0);
		await expectNoErrorPage(page);
	});
});
