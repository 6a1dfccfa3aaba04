/**
 * Photo uploads through POST /api/uploads against a private S3 stand-in and the seeded test
 * database: sizes and formats read back through the S3 SDK and sharp, EXIF/GPS gone, and every
 * kind of bad file refused with a message and nothing stored.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import { ListObjectsV2Command } from '@aws-sdk/client-s3';
import sharp from 'sharp';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startS3Server } from '../../mocks/s3/server';

let server: Awaited<ReturnType<typeof startS3Server>>;
let dir: string;

beforeAll(async () => {
	dir = fs.mkdtempSync(path.join(os.tmpdir(), 'chipstall-s3-up-'));
	server = await startS3Server({ port: 0, directory: dir });
	process.env.S3_PORT = String(server.port);
});

afterAll(async () => {
	await server.close();
	fs.rmSync(dir, { recursive: true, force: true });
});

const load = async () => ({
	POST: (await import('../../src/routes/api/uploads/+server')).POST,
	storage: await import('$lib/server/catalogue/photo-storage'),
	config: (await import('$lib/server/config')).config,
	photosDomain: await import('$lib/server/catalogue/photos'),
	db: (await import('$lib/server/db')).db,
	schema: await import('$lib/server/db/schema')
});

async function pieceId() {
	const { db, schema } = await load();
	const [p] = await db
		.select({ id: schema.pieces.id })
		.from(schema.pieces)
		.where(eq(schema.pieces.slug, 'welcome-plate'));
	return p.id;
}

async function upload(bytes: Buffer, name: string, type: string, role = 'owner') {
	const { POST } = await load();
	const body = new FormData();
	body.set('pieceId', String(await pieceId()));
	body.set('alt', 'Welcome plate in cherry, from above');
	body.set('file', new File([new Uint8Array(bytes)], name, { type }));
	const request = new Request('http://localhost/api/uploads', { method: 'POST', body });
	try {
		return await POST({
			request,
			locals: { user: { role } },
			url: new URL(request.url)
		} as never);
	} catch (thrown) {
		const s = (thrown as { status?: number }).status;
		if (s) return new Response(null, { status: s });
		throw thrown;
	}
}

async function listKeys(prefix: string) {
	const { storage, config } = await load();
	const out = await storage
		.s3()
		.send(new ListObjectsV2Command({ Bucket: config.s3.bucket, Prefix: prefix }));
	return (out.Contents ?? []).map((o) => o.Key!).sort();
}

async function photoRows() {
	const { db, schema } = await load();
	return db
		.select()
		.from(schema.photos)
		.where(eq(schema.photos.pieceId, await pieceId()));
}

/** A PNG with only a signature, IHDR and a tiny IDAT: a few bytes claiming width × height. */
function bombPng(width: number, height: number) {
	const chunk = (type: string, data: Buffer) => {
		const len = Buffer.alloc(4);
		len.writeUInt32BE(data.length);
		const td = Buffer.concat([Buffer.from(type, 'ascii'), data]);
		const crc = Buffer.alloc(4);
		crc.writeUInt32BE(crc32(td));
		return Buffer.concat([len, td, crc]);
	};
	const ihdr = Buffer.alloc(13);
	ihdr.writeUInt32BE(width, 0);
	ihdr.writeUInt32BE(height, 4);
	ihdr.set([8, 2, 0, 0, 0], 8); // 8-bit RGB (PNG spec, IHDR)
	return Buffer.concat([
		Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
		chunk('IHDR', ihdr),
		chunk('IDAT', zlib.deflateSync(Buffer.alloc(64 * 1024))),
		chunk('IEND', Buffer.alloc(0))
	]);
}

/** CRC-32 as the PNG specification defines it (ISO 3309 polynomial). */
function crc32(buf: Buffer) {
	let c = ~0;
	for (const b of buf) {
		c ^= b;
		for (let k = 0; k < 8; k++) c = (c >>> 1) ^ (0xedb88320 & -(c & 1));
	}
	return ~c >>> 0;
}

describe('photo uploads', () => {
	it('a JPEG with GPS EXIF comes back in every size and format with no EXIF left', async () => {
		const input = await sharp({
			create: { width: 2400, height: 1800, channels: 3, background: { r: 160, g: 112, b: 80 } }
		})
			.jpeg()
			.withExif({
				IFD0: { Make: 'BenchCam' },
				IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '44/1 30/1 0/1' }
			})
			.toBuffer();
		// The input really carries GPS: the GPS IFD pointer tag 0x8825 (EXIF 2.32, tag 34853).
		const inMeta = await sharp(input).metadata();
		expect(inMeta.exif).toBeDefined();
		expect(
			inMeta.exif!.includes(Buffer.from([0x88, 0x25])) ||
				inMeta.exif!.includes(Buffer.from([0x25, 0x88]))
		).toBe(true);

		const res = await upload(input, 'plate.jpg', 'image/jpeg');
		expect(res.status).toBe(201);
		const { photo } = (await res.json()) as { photo: { storageKey: string; width: number } };
		expect(photo.width).toBe(2400);

		const keys = await listKeys(`${photo.storageKey}/`);
		const widths = [400, 800, 1600];
		expect(keys).toEqual(
			widths
				.flatMap((w) => [`${photo.storageKey}/${w}.jpg`, `${photo.storageKey}/${w}.webp`])
				.sort()
		);
		const { storage } = await load();
		for (const key of keys) {
			const bytes = await storage.getObjectBytes(key);
			const meta = await sharp(bytes!).metadata();
			const w = Number(key.split('/').pop()!.split('.')[0]);
			expect(meta.width).toBe(w);
			expect(meta.height).toBe((w * 3) / 4);
			expect(meta.format).toBe(key.endsWith('.webp') ? 'webp' : 'jpeg');
			expect(meta.exif).toBeUndefined();
		}
		// Served with a long, immutable cache lifetime.
		const { GET } = await import('../../src/routes/photos/[...key]/+server');
		const served = await GET({
			params: { key: `${photo.storageKey}/800.jpg` },
			request: new Request('http://x/')
		} as never);
		expect(served.headers.get('cache-control')).toBe('public, max-age=31536000, immutable');
		expect(served.headers.get('content-type')).toBe('image/jpeg');
	});

	const valid = () =>
		sharp({ create: { width: 900, height: 600, channels: 3, background: '#886644' } })
			.jpeg()
			.toBuffer();

	const bad: [
		string,
		() => [Buffer, string, string] | Promise<[Buffer, string, string]>,
		RegExp,
		// 413 Content Too Large for a body over the limit (RFC 9110 §15.5.14), else 400.
		number?
	][] = [
		[
			'plain text',
			() => [Buffer.from('just some words'), 'notes.jpg', 'image/jpeg'],
			/not a photo/
		],
		[
			'a truncated JPEG',
			async () => {
				const b = await valid();
				return [b.subarray(0, Math.floor(b.length * 0.6)), 'cut.jpg', 'image/jpeg'];
			},
			/damaged or cut off/
		],
		[
			'a 50,000 × 50,000 px PNG of a few KB',
			() => [bombPng(50_000, 50_000), 'bomb.png', 'image/png'],
			/50000 × 50000 pixels/
		],
		[
			'a file over the size limit',
			async () => {
				const b = await valid();
				return [Buffer.concat([b, Buffer.alloc(13 * 1024 * 1024)]), 'big.jpg', 'image/jpeg'];
			},
			/at most 12 MB/,
			413
		],
		[
			'an SVG with a script',
			() => [
				Buffer.from(
					'<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><script>alert(1)</script></svg>'
				),
				'photo.svg',
				'image/svg+xml'
			],
			/not a photo/
		],
		[
			'an executable renamed .jpg',
			() => {
				// A DOS/PE header: "MZ" magic, e_lfanew at 0x3c pointing to "PE\0\0".
				const b = Buffer.alloc(512);
				b.write('MZ', 0, 'ascii');
				b.writeUInt32LE(0x80, 0x3c);
				b.write('PE\0\0', 0x80, 'binary');
				return [b, 'holiday.jpg', 'image/jpeg'];
			},
			/not a photo we take \(it is EXE\)/
		]
	];

	for (const [label, make, message, status = 400] of bad) {
		it(`refuses ${label} with a clear message and stores nothing`, async () => {
			const before = await listKeys('pieces/welcome-plate/');
			const rowsBefore = (await photoRows()).length;
			const [bytes, name, type] = await make();
			const res = await upload(bytes, name, type);
			expect(res.status).toBe(status);
			const body = (await res.json()) as { error: string };
			expect(body.error).toMatch(message);
			expect(body.error).toContain(name);
			expect(await listKeys('pieces/welcome-plate/')).toEqual(before);
			expect((await photoRows()).length).toBe(rowsBefore);
		});
	}

	it('only the owner may upload', async () => {
		const res = await upload(await valid(), 'a.jpg', 'image/jpeg', 'helper');
		expect(res.status).toBe(403);
	});

	it('reorder, alt text and delete; deleting removes every stored object', async () => {
		const a = (await (await upload(await valid(), 'a.jpg', 'image/jpeg')).json()) as {
			photo: { id: number; storageKey: string };
		};
		const b = (await (await upload(await valid(), 'b.jpg', 'image/jpeg')).json()) as {
			photo: { id: number; storageKey: string };
		};
		const { photosDomain } = await load();
		const id = await pieceId();
		await photosDomain.movePhoto(id, b.photo.id, -1);
		const order = (await photosDomain.listPhotos(id)).map((p) => p.id);
		expect(order.indexOf(b.photo.id)).toBe(order.indexOf(a.photo.id) - 1);
		await photosDomain.setPhotoAlt(id, a.photo.id, 'Plate rim, close up');
		expect((await photosDomain.listPhotos(id)).find((p) => p.id === a.photo.id)?.alt).toBe(
			'Plate rim, close up'
		);
		expect((await listKeys(`${a.photo.storageKey}/`)).length).toBe(6);
		await photosDomain.deletePhoto(id, a.photo.id);
		expect(await listKeys(`${a.photo.storageKey}/`)).toEqual([]);
		expect((await photosDomain.listPhotos(id)).some((p) => p.id === a.photo.id)).toBe(false);
		await expect(photosDomain.deletePhoto(id, a.photo.id)).rejects.toThrow(/gone/);
	});
});
