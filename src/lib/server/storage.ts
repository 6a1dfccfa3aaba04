import {
	GetObjectCommand,
	PutObjectCommand,
	DeleteObjectsCommand,
	ListObjectsV2Command,
	NoSuchKey,
	S3Client
} from '@aws-sdk/client-s3';
import { Readable } from 'node:stream';
import sharp, { type Metadata } from 'sharp';
import { config } from './config';

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

/** Widths of the responsive variants; pages build srcset from these. */
export const PHOTO_WIDTHS = [320, 640, 1200] as const;

/** Where one variant lives; also the path under /photos/ that serves it. */
export const photoKey = (key: string, width: number) => `${key}/${width}.webp`;

/**
 * Stores a photo as WebP variants at PHOTO_WIDTHS (never upscaled beyond the original) and
 * returns the original's upright size. Throws a clear error when the input is not an image.
 */
export async function storePhoto(
	key: string,
	input: Buffer
): Promise<{ width: number; height: number }> {
	let meta: Metadata;
	try {
		meta = await sharp(input).metadata();
	} catch {
		throw new Error('The file is not an image we can read (use JPEG, PNG or WebP).');
	}
	if (!meta.width || !meta.height) throw new Error('The image has no size.');
	// EXIF orientations 5–8 swap width and height once rotated upright.
	const swapped = (meta.orientation ?? 1) >= 5;
	const width = swapped ? meta.height : meta.width;
	const height = swapped ? meta.width : meta.height;

	await Promise.all(
		PHOTO_WIDTHS.map(async (w) => {
			const out = await sharp(input)
				.rotate()
				.resize({ width: w, withoutEnlargement: true })
				.webp({ quality: 80 })
				.toBuffer();
			await putObject(photoKey(key, w), out, 'image/webp');
		})
	);
	return { width, height };
}
