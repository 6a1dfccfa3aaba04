import { expect, test, type Locator, type Page } from '@playwright/test';
import net from 'node:net';
import { randomBytes } from 'node:crypto';
import sharp from 'sharp';
import { signInAs } from '../../helpers/auth';
import { mailInboxUrl, waitForMail, type CaughtMail } from '../../helpers/mail';

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
				if (headers['transfer-encoding']?.includes('chunked')) {
					const body = this.chunked(end + 4);
					if (body) return { status: Number(head[0].split(' ')[1]), headers, body };
				}
				const length = Number(headers['content-length'] ?? 0);
				if (!headers['transfer-encoding'] && this.buffer.length >= end + 4 + length) {
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

	/** A whole chunked body from `at` (RFC 9112 §7.1), consumed from the buffer; null until then. */
	private chunked(at: number): string | null {
		const parts: Buffer[] = [];
		let i = at;
		for (;;) {
			const eol = this.buffer.indexOf('\r\n', i);
			if (eol < 0) return null;
			const size = parseInt(this.buffer.subarray(i, eol).toString('latin1'), 16);
			if (size === 0) {
				if (this.buffer.length < eol + 4) return null;
				this.buffer = this.buffer.subarray(eol + 4);
				return Buffer.concat(parts).toString('utf8');
			}
			if (this.buffer.length < eol + 2 + size + 2) return null;
			parts.push(this.buffer.subarray(eol + 2, eol + 2 + size));
			i = eol + 2 + size + 2;
		}
	}

	end() {
		this.socket.destroy();
	}
}

/** The API's `{ error }` sentence from a JSON body. */
const errorOf = (body: string) => (JSON.parse(body) as { error?: string }).error;

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
		expect(errorOf(first.body)).toMatch(/at most 64 KB of JSON/);
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
		expect(errorOf(first.body)).toMatch(/at most 12 MB/);
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
		expect(errorOf(await fits.text())).toMatch(/no such fair/);
		const tooBig = await page.request.post('/api/booth/999999/sales', {
			headers: { 'content-type': 'application/json' },
			data: JSON.stringify({ sales: [], pad: 'x'.repeat(2_100_000) })
		});
		expect(tooBig.status()).toBe(413);
		expect(errorOf(await tooBig.text())).toMatch(/at most 2 MB/);
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

/** What the sweep types: nothing at all, or far more than any field takes. */
const EMPTY = '';
const TOO_LONG = 'W'.repeat(5000);

/** zod's own wording, which no person should read on a form. */
const RAW_MESSAGES = /Too (big|small): expected|Invalid input|expected string|received undefined/;

/**
 * Fills every text-like field of the form with `value`, presses its button, and checks what the
 * person sees: the same page, no error page, a sentence (an alert, or the browser's own message
 * on a field it would not send), and never zod's raw wording.
 */
async function sweep(page: Page, url: string, form: string, button: RegExp, value: string) {
	await page.goto(url, { waitUntil: 'networkidle' });
	const f = page.locator(form).first();
	await expect(f, `${url} ${form}`).toBeVisible();
	const fields = f.locator(
		'input:not([type=hidden]):not([type=radio]):not([type=checkbox]):not([type=file]):not([readonly]), textarea'
	);
	for (const field of await fields.all()) {
		if (!(await field.isVisible()) || !(await field.isEditable())) continue;
		const type = await field.getAttribute('type');
		const v =
			value === TOO_LONG && (type === 'number' || type === 'date')
				? type === 'number'
					? '999999999'
					: ''
				: value;
		await field.fill(v).catch(() => {});
	}
	const path = new URL(page.url()).pathname;
	await f.getByRole('button', { name: button }).first().click();
	// Either the browser kept the form back with its own message, or the server answered.
	const browserRefused = await f
		.evaluate((el) => !(el as HTMLFormElement).checkValidity())
		.catch(() => false);
	if (!browserRefused || (await f.getAttribute('novalidate')) !== null) {
		await expect(
			page.locator('[role=alert]:visible, [aria-invalid=true]:visible').first(),
			`${url} ${form} with ${value ? 'too long' : 'empty'} fields shows a message`
		).toBeVisible();
	}
	expect(new URL(page.url()).pathname).toBe(path);
	await expectNoErrorPage(page);
	await expect(page.locator('body')).not.toContainText(RAW_MESSAGES);
}

test.describe('every field empty, then too long, on each main form', () => {
	const publicForms: [string, string, RegExp][] = [
		['/signin', 'main form', /^Sign in$/],
		['/signup', 'main form', /Make my account/],
		['/reset', 'main form', /Send me a link/]
	];
	for (const [url, form, button] of publicForms) {
		for (const [what, value] of [
			['empty', EMPTY],
			['too long', TOO_LONG]
		] as const) {
			test(`${url}: ${what}`, async ({ page }) => {
				await sweep(page, url, form, button, value);
			});
		}
	}

	test('the piece page’s ready-made form and the checkout: empty, then too long', async ({
		page
	}) => {
		await page.goto('/shop/welcome-plate', { waitUntil: 'networkidle' });
		const ready = page.locator('form[aria-labelledby="ready-heading"]');
		if (await ready.count()) {
			for (const q of ['', '999999999']) {
				await ready.getByLabel('How many').fill(q);
				await ready.getByRole('button', { name: 'Add to basket' }).click();
				await expect(ready.locator('[role=alert]')).toBeVisible();
				await expectNoErrorPage(page);
			}
		}
		// A basket, then the checkout's every field empty and too long.
		await page.request.post('/api/cart', {
			headers: { 'content-type': 'application/json' },
			data: { slug: 'rosette-bottle-holder', wood: 'basswood', initials: 'FC' }
		});
		for (const value of [EMPTY, TOO_LONG]) {
			await sweep(page, '/checkout', 'main form', /^Pay /, value);
			await expect(page.getByLabel('E-mail')).toHaveAttribute('aria-invalid', 'true');
		}
	});

	const workshopForms: [string, string, RegExp][] = [
		['/workshop/pieces/new', 'main form', /Add the piece/],
		['/workshop/settings', 'form[action="?/shop"]', /^Save$/],
		['/workshop/settings', 'form[action="?/policies"]', /^Save$/],
		['/workshop/fairs', 'form[action="?/create"]', /Add the fair/],
		['/workshop/people', 'form[action="?/add"]', /Add|Invite/]
	];
	test('the workshop’s forms: pieces, settings, fairs, people', async ({ page }) => {
		test.setTimeout(180_000);
		await signInAs(page, 'owner');
		for (const [url, form, button] of workshopForms) {
			for (const value of [EMPTY, TOO_LONG]) {
				// An empty policies form is a valid one (no extra words); only too long is refused.
				if (form.includes('policies') && value === EMPTY) continue;
				await sweep(page, url, form, button, value);
			}
		}
	});
});

test.describe('names and places outside English', () => {
	for (const [who, city, country, region, postcode] of [
		['Łukasz Wiśniewski', 'Łódź', 'PL', 'Łódzkie', '90-001'],
		['Zoë Müller', 'Zürich', 'CH', 'Zürich', '8001'],
		['João Araújo', 'São Paulo', 'PT', 'Lisboa', '1100-148'],
		['山田 太郎', '東京', 'JP', 'Tokyo', '100-0001'],
		['Ada Linden', 'Burlington', 'US', 'Vermont', '05401']
	]) {
		test(`${who}, ${city}: the checkout takes the address as typed and goes to payment`, async ({
			page
		}) => {
			await page.request.post('/api/cart', {
				headers: { 'content-type': 'application/json' },
				data: { slug: 'rosette-bottle-holder', wood: 'basswood', initials: 'AB' }
			});
			await page.goto('/checkout', { waitUntil: 'networkidle' });
			await page.getByLabel('Country').selectOption(country);
			await page.getByLabel('Name', { exact: true }).fill(who);
			await page.getByLabel('E-mail').fill('buyer@example.test');
			await page.getByLabel('Street address').fill('ul. Piotrkowska 1');
			await page.getByLabel('Town or city').fill(city);
			await page.getByLabel('State or region').fill(region);
			await page.getByLabel('Postcode or ZIP').fill(postcode);
			await page.getByLabel('Gift note (optional)').fill('Wszystkiego najlepszego 🎉 — à bientôt');
			await page.getByTestId('pay').click();
			await expect(page.getByRole('heading', { name: 'Pay by card' })).toBeVisible({
				timeout: 15_000
			});
		});
	}

	test('a right-to-left mark pasted into a name is refused with a sentence, and the rest is kept', async ({
		page
	}) => {
		await page.request.post('/api/cart', {
			headers: { 'content-type': 'application/json' },
			data: { slug: 'rosette-bottle-holder', wood: 'basswood', initials: 'AB' }
		});
		await page.goto('/checkout', { waitUntil: 'networkidle' });
		await page.getByLabel('Name', { exact: true }).fill('Ada \u200fLinden');
		await page.getByLabel('Town or city').fill('Zürich');
		await page.getByTestId('pay').click();
		await expect(page.getByText(/hidden control or text-direction characters/)).toBeVisible();
		await expect(page.getByLabel('Town or city')).toHaveValue('Zürich');
		await expectNoErrorPage(page);
	});
});

/** Counts the POSTs a page sends to paths matching `path`. */
function countPosts(page: Page, path: RegExp) {
	const seen = { n: 0 };
	page.on('request', (r) => {
		if (r.method() === 'POST' && path.test(new URL(r.url()).pathname + new URL(r.url()).search))
			seen.n++;
	});
	return seen;
}

test.describe('a double click records once', () => {
	test('add to basket, ready-made and with initials', async ({ page }) => {
		await page.goto(PIECE, { waitUntil: 'networkidle' });
		const posts = countPosts(page, /\/shop\/rosette-bottle-holder\?\/add/);
		const section = page.getByRole('region', { name: 'Carved with your initials' });
		await section.getByRole('textbox', { name: 'Initials' }).fill('MJ');
		await section.getByRole('button', { name: 'Add to basket with these initials' }).dblclick();
		await expect(page.getByTestId('added-notice')).toBeVisible();
		await expect(page.getByTestId('cart-count')).toHaveText('1');
		expect(posts.n).toBe(1);
	});

	test('the checkout’s pay button opens one payment page', async ({ page }) => {
		await page.request.post('/api/cart', {
			headers: { 'content-type': 'application/json' },
			data: { slug: 'rosette-bottle-holder', wood: 'basswood', initials: 'AB' }
		});
		await page.goto('/checkout', { waitUntil: 'networkidle' });
		const posts = countPosts(page, /^\/checkout/);
		await page.getByLabel('Name', { exact: true }).fill('Ada Linden');
		await page.getByLabel('E-mail').fill('double@example.test');
		await page.getByLabel('Street address').fill('4 Mill Lane');
		await page.getByLabel('Town or city').fill('Burlington');
		await page.getByLabel('State or region').fill('VT');
		await page.getByLabel('Postcode or ZIP').fill('05401');
		await page.getByTestId('pay').dblclick();
		await expect(page.getByRole('heading', { name: 'Pay by card' })).toBeVisible({
			timeout: 15_000
		});
		expect(posts.n).toBe(1);
	});

	test('sign-up sends one e-mail', async ({ page }) => {
		const email = `double-${Date.now()}@example.test`;
		await page.goto('/signup', { waitUntil: 'networkidle' });
		const posts = countPosts(page, /^\/signup/);
		await page.getByLabel('Your name').fill('Zoë Müller');
		await page.getByLabel('E-mail').fill(email);
		await page.getByLabel('Password', { exact: true }).fill('a long enough password 2026');
		await page.getByLabel('Password again').fill('a long enough password 2026');
		await page.locator('main form').getByRole('button').last().dblclick();
		await expect(page.locator('main')).toContainText(/e-mail|link/i);
		expect(posts.n).toBe(1);
		await waitForMail(email);
		const res = await fetch(mailInboxUrl());
		const list = (await res.json()) as CaughtMail[];
		expect(list.filter((m) => m.to.includes(email))).toHaveLength(1);
	});

	test('workshop saves: settings and a piece', async ({ page }) => {
		await signInAs(page, 'owner', '/workshop/settings');
		const posts = countPosts(page, /\?\/(shop|save)$/);
		const shop = page.locator('form[action="?/shop"]');
		await shop.getByRole('button', { name: 'Save' }).dblclick();
		await expect(shop.getByText('Saved.')).toBeVisible();
		expect(posts.n).toBe(1);
		await page.goto('/workshop/pieces');
		await page.getByRole('link', { name: 'Welcome plate' }).click();
		await page.getByRole('button', { name: 'Save changes' }).dblclick();
		await expect(page.getByText('Saved.')).toBeVisible();
		expect(posts.n).toBe(2);
	});
});

/** A phone photo: 4000×3000, several MB, turned by EXIF (orientation 6), with GPS in its EXIF. */
async function phoneJpeg() {
	const W = 4000;
	const H = 3000;
	const raw = randomBytes(W * H * 3);
	for (let y = 0; y < H; y++) {
		const row = y * W * 3;
		for (let x = 0; x < W * 3; x++)
			raw[row + x] = 40 + (y * 80) / H + ((x / 3) * 60) / W + (raw[row + x] & 63);
	}
	return sharp(raw, { raw: { width: W, height: H, channels: 3 } })
		.jpeg({ quality: 90 })
		.withExif({
			IFD0: { Make: 'Phone', Model: 'Camera' },
			IFD3: {
				GPSLatitudeRef: 'N',
				GPSLatitude: '44/1 28/1 0/1',
				GPSLongitudeRef: 'W',
				GPSLongitude: '73/1 12/1 0/1'
			}
		})
		.withMetadata({ orientation: 6 })
		.toBuffer();
}

/** The GPS IFD pointer tag 0x8825 (EXIF 2.32, tag 34853), in either byte order. */
const hasGps = (exif: Buffer | undefined) =>
	!!exif && (exif.includes(Buffer.from([0x88, 0x25])) || exif.includes(Buffer.from([0x25, 0x88])));

test.describe('photos as phones take them', () => {
	test('a 4000×3000 phone JPEG uploads with its progress, upright and without its GPS; a screenshot too; a bad file turns red with the reason', async ({
		page
	}) => {
		const jpeg = await phoneJpeg();
		expect(jpeg.length).toBeGreaterThan(3 * 1024 * 1024);
		const before = await sharp(jpeg).metadata();
		expect([before.width, before.height, before.orientation]).toEqual([4000, 3000, 6]);
		expect(hasGps(before.exif)).toBe(true);
		const png = await sharp({
			create: { width: 1170, height: 2532, channels: 3, background: '#f4efe6' }
		})
			.composite([
				{
					input: Buffer.from(
						'<svg width="1170" height="2532"><rect x="40" y="200" width="1090" height="600" fill="#6b4a2b"/><circle cx="585" cy="1400" r="400" fill="#c89b6d"/><text x="80" y="2200" font-size="72">Rosette, front</text></svg>'
					)
				}
			])
			.png()
			.toBuffer();

		// Not the welcome plate, whose photos tests/e2e/photos.spec.ts counts.
		await signInAs(page, 'owner', '/workshop/pieces');
		await page.getByRole('link', { name: 'Keepsake box' }).click();
		// A phone's upload speed (about 8 Mbit/s), so the bar moves as a person would see it.
		const cdp = await page.context().newCDPSession(page);
		await cdp.send('Network.enable');
		await cdp.send('Network.emulateNetworkConditions', {
			offline: false,
			latency: 40,
			downloadThroughput: 5_000_000,
			uploadThroughput: 1_000_000
		});
		await page.getByLabel('Photos to upload').setInputFiles([
			{ name: 'IMG_2041.jpg', mimeType: 'image/jpeg', buffer: jpeg },
			{ name: 'Screenshot.png', mimeType: 'image/png', buffer: png },
			{ name: 'notes.jpg', mimeType: 'image/jpeg', buffer: Buffer.from('not a photo at all') }
		]);
		const bar = page.getByRole('progressbar', { name: 'Upload of IMG_2041.jpg' });
		// Part-way: the bar shows some of the bytes sent, not all and not none.
		await expect
			.poll(
				async () => {
					const v = Number(await bar.getAttribute('value'));
					const max = Number(await bar.getAttribute('max'));
					return v > 0 && v < max;
				},
				{ timeout: 20_000, intervals: [100] }
			)
			.toBe(true);
		const uploads = page.getByTestId('upload');
		await expect(uploads.filter({ hasText: 'IMG_2041.jpg' })).toContainText('Stored', {
			timeout: 60_000
		});
		await expect(uploads.filter({ hasText: 'Screenshot.png' })).toContainText('Stored');
		const refused = uploads.filter({ hasText: 'notes.jpg' });
		await expect(refused).toContainText('Refused');
		await expect(refused.getByRole('alert')).toContainText(/notes\.jpg: /);
		const redBar = refused.getByRole('progressbar');
		await expect(redBar).toHaveAttribute('data-state', 'refused');
		// The bar is painted in its accent colour: red (--c-danger #a3271b) for a refusal, the
		// green of "go" (--c-moss #4f6b3a) for a stored photo.
		const accent = (bar: Locator) => bar.evaluate((el) => getComputedStyle(el).accentColor);
		expect(await accent(redBar)).toBe('rgb(163, 39, 27)');
		expect(await accent(bar)).toBe('rgb(79, 107, 58)');
		await cdp.send('Network.emulateNetworkConditions', {
			offline: false,
			latency: 0,
			downloadThroughput: -1,
			uploadThroughput: -1
		});

		// The shop serves it upright (portrait, from orientation 6) and with no EXIF, GPS included.
		await page.goto('/shop/keepsake-box');
		await page.getByRole('button', { name: /Show photo \d: .*IMG_2041/ }).click();
		const main = page.getByRole('img', { name: /IMG_2041/ });
		const srcset = (await main.getAttribute('srcset'))!;
		const largest = /(\/photos\/\S+\/1600\.jpg)/.exec(srcset)![1];
		const served = await page.request.get(largest);
		expect(served.status()).toBe(200);
		const meta = await sharp(await served.body()).metadata();
		expect(meta.height).toBeGreaterThan(meta.width);
		expect(hasGps(meta.exif)).toBe(false);
		expect(meta.exif).toBeUndefined();
	});
});

test.describe('on a 390×844 phone, the answer is where the eye is', () => {
	test.use({ viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true });

	test('“Added to your basket” and the empty-initials sentence show in view, announced', async ({
		page
	}) => {
		await page.goto(PIECE, { waitUntil: 'networkidle' });
		const section = page.getByRole('region', { name: 'Carved with your initials' });
		const add = section.getByRole('button', { name: 'Add to basket with these initials' });
		await add.scrollIntoViewIfNeeded();
		await add.click();
		const help = section.getByText('Type one to three letters for the rosette.');
		await expect(help).toBeInViewport();
		await expect(section.locator('#pz-initials-help')).toHaveAttribute('aria-live', 'polite');

		await section.getByRole('textbox', { name: 'Initials' }).fill('JW');
		await add.scrollIntoViewIfNeeded();
		await add.click();
		const notice = page.getByTestId('added-notice');
		await expect(notice).toBeVisible();
		await expect(notice).toBeInViewport();
		await expect(notice.locator('xpath=..')).toHaveAttribute('aria-live', 'polite');
	});

	test('a refused checkout shows its sentence in view', async ({ page }) => {
		await page.request.post('/api/cart', {
			headers: { 'content-type': 'application/json' },
			data: { slug: 'rosette-bottle-holder', wood: 'basswood', initials: 'AB' }
		});
		await page.goto('/checkout', { waitUntil: 'networkidle' });
		await page.getByLabel('Name', { exact: true }).fill('Ada Linden');
		await page.getByLabel('E-mail').fill('ada@example.test');
		await page.getByLabel('Street address').fill('4 Mill Lane');
		await page.getByLabel('Town or city').fill('Burlington');
		await page.getByLabel('State or region').fill('Vermontt');
		await page.getByLabel('Postcode or ZIP').fill('05401');
		await page.getByTestId('pay').scrollIntoViewIfNeeded();
		await page.getByTestId('pay').click();
		const message = page.getByText(/We do not know “Vermontt” as a state/);
		await expect(message).toBeVisible();
		await expect(page.getByLabel('State or region')).toBeInViewport();
		await page.getByLabel('State or region').fill('Vermont');
		await page.getByTestId('pay').click();
		await expect(page.getByRole('heading', { name: 'Pay by card' })).toBeVisible({
			timeout: 15_000
		});
	});
});
