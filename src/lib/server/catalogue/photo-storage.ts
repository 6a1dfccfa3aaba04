import {
	GetObjectCommand,
	PutObjectCommand,
	DeleteObjectsCommand,
	ListObjectsV2Command,
	NoSuchKey,
	S3Client
} from '@aws-sdk/client-s3';
import { Readable } from 'node:stream';
import { fileTypeFromBuffer } from 'file-type';
import sharp, { type Metadata } from 'sharp';
import { config } from '../config';
import {
	MAX_PHOTO_BYTES,
	MAX_PHOTO_PIXELS,
	PHOTO_TYPES,
	PHOTO_TYPES_TEXT
} from '$lib/catalogue/photo-limits';
import { PHOTO_WIDTHS, type PhotoFormat } from '$lib/catalogue/photos';
import { DomainError } from '../errors/domain-error';

let client: S3Client | undefined;

/**
 * One S3 client per process. Path-style and "checksums only when required": with the SDK's
 * default checksums s3rver stores streamed uploads with chunk framing inside the object.
 */
export function s3(): S3Client {
	client ??= new S3Client({
		endpoint: config.s3.endpoint || undefined,
		region: config.s3.region,
		credentials: {
			accessKeyId: config.s3.accessKeyId,
			secretAccessKey: config.s3.secretAccessKey
		},
		forcePathStyle: true,
		requestChecksumCalculation: 'WHEN_REQUIRED',
		responseChecksumValidation: 'WHEN_REQUIRED'
	});
	return client;
}

/**
 * Stores bytes or a stream. A stream needs its length (S3 wants Content-Length for a single PUT);
 * with checksums only when required it is stored as sent, with no chunk framing inside.
 */
export async function putObject(
	key: string,
	body: Buffer | Uint8Array | Readable,
	contentType: string,
	contentLength?: number
) {
	await s3().send(
		new PutObjectCommand({
			Bucket: config.s3.bucket,
			Key: key,
			Body: body,
			ContentType: contentType,
			ContentLength: contentLength ?? (body instanceof Readable ? undefined : body.byteLength)
		})
	);
}

export type StoredObject = {
	body: ReadableStream;
	contentType: string;
	contentLength?: number;
	etag?: string;
	lastModified?: Date;
};

/** Reads an object as a web stream; null when the key does not exist. */
export async function getObject(key: string): Promise<StoredObject | null> {
	try {
		const out = await s3().send(new GetObjectCommand({ Bucket: config.s3.bucket, Key: key }));
		if (!out.Body) return null;
		return {
			body: out.Body.transformToWebStream(),
			contentType: out.ContentType ?? 'application/octet-stream',
			contentLength: out.ContentLength,
			etag: out.ETag,
			lastModified: out.LastModified
		};
	} catch (err) {
		if (err instanceof NoSuchKey || (err as { name?: string }).name === 'NoSuchKey') return null;
		// A key the store refuses outright (too long, malformed) names no object either.
		const status = (err as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;
		if (status !== undefined && status >= 400 && status < 500) return null;
		throw err;
	}
}

/** Reads a whole object into memory; null when missing. */
export async function getObjectBytes(key: string): Promise<Buffer | null> {
	const obj = await getObject(key);
	if (!obj) return null;
	return Buffer.from(await new Response(obj.body).arrayBuffer());
}

/** Deletes every object under a prefix (e.g. all variants of one photo). */
export async function deletePrefix(prefix: string) {
	const listed = await s3().send(
		new ListObjectsV2Command({ Bucket: config.s3.bucket, Prefix: prefix })
	);
	const keys = (listed.Contents ?? []).map((o) => ({ Key: o.Key! }));
	if (keys.length) {
		await s3().send(
			new DeleteObjectsCommand({
				Bucket: config.s3.bucket,
				Delete: { Objects: keys }
			})
		);
	}
}

/** Where one variant lives; also the path under /photos/ that serves it. */
export const photoKey = (key: string, width: number, format: PhotoFormat = 'webp') =>
	`${key}/${width}.${format}`;

export { PHOTO_WIDTHS };

/**
 * Checks a photo by its bytes, not its name: size, type by content (file-type), pixel count
 * from the header (before anything is decoded). Returns the upright size.
 */
export async function checkPhoto(input: Buffer): Promise<{ width: number; height: number }> {
	if (input.byteLength === 0) throw new DomainError(400, 'The file is empty.', { code: 'photo' });
	if (input.byteLength > MAX_PHOTO_BYTES)
		throw new DomainError(
			400,
			`The file is larger than ${MAX_PHOTO_BYTES / 1024 / 1024} MB; export a smaller JPEG.`,
			{ code: 'photo' }
		);
	const type = await fileTypeFromBuffer(input);
	if (!type || !(PHOTO_TYPES as readonly string[]).includes(type.mime)) {
		throw new DomainError(
			400,
			`This is not a photo we take (${type ? `it is ${type.ext.toUpperCase()}` : 'unknown type'}); use ${PHOTO_TYPES_TEXT}.`,
			{ code: 'photo' }
		);
	}
	let meta: Metadata;
	try {
		meta = await sharp(input, { limitInputPixels: false }).metadata();
	} catch {
		throw new DomainError(400, `The file is not an image we can read (use ${PHOTO_TYPES_TEXT}).`, {
			code: 'photo'
		});
	}
	if (!meta.width || !meta.height)
		throw new DomainError(400, 'The image has no size.', { code: 'photo' });
	if (meta.width * meta.height > MAX_PHOTO_PIXELS) {
		throw new DomainError(
			400,
			`The image claims ${meta.width} × ${meta.height} pixels, more than the ${MAX_PHOTO_PIXELS / 1e6} megapixels we accept.`,
			{ code: 'photo' }
		);
	}
	// EXIF orientations 5–8 swap width and height once rotated upright.
	const swapped = (meta.orientation ?? 1) >= 5;
	return swapped
		? { width: meta.height, height: meta.width }
		: { width: meta.width, height: meta.height };
}

/**
 * Stores a photo as WebP variants with a JPEG fallback at PHOTO_WIDTHS (never upscaled), upright
 * and with no metadata (sharp writes none unless asked, so EXIF and GPS are dropped). Every
 * variant is made before the first is stored, so a damaged file stores nothing; a failed store
 * removes what it wrote. Returns the original's upright size.
 */
export async function storePhoto(
	key: string,
	input: Buffer
): Promise<{ width: number; height: number }> {
	const size = await checkPhoto(input);
	const variants: { key: string; body: Buffer; type: string }[] = [];
	try {
		for (const w of PHOTO_WIDTHS) {
			// failOn 'truncated': a cut-off file is refused instead of stored half grey.
			const base = sharp(input, { failOn: 'truncated', limitInputPixels: MAX_PHOTO_PIXELS })
				.rotate()
				.resize({ width: w, withoutEnlargement: true });
			const [webp, jpg] = await Promise.all([
				base.clone().webp({ quality: 80 }).toBuffer(),
				base
					.clone()
					.flatten({ background: '#ffffff' })
					.jpeg({ quality: 82, mozjpeg: true })
					.toBuffer()
			]);
			variants.push({ key: photoKey(key, w, 'webp'), body: webp, type: 'image/webp' });
			variants.push({ key: photoKey(key, w, 'jpg'), body: jpg, type: 'image/jpeg' });
		}
	} catch {
		throw new DomainError(400, 'The image is damaged or cut off; export it again and retry.', {
			code: 'photo'
		});
	}
	try {
		await Promise.all(variants.map((v) => putObject(v.key, v.body, v.type)));
	} catch (err) {
		await deletePrefix(`${key}/`);
		throw err;
	}
	return size;
}
