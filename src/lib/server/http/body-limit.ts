import { apiError } from './api-errors';
import { MAX_PHOTO_BYTES } from '$lib/catalogue/photo-limits';
import { BOOTH_MAX_BYTES } from '$lib/booth/sync-message';

/**
 * Each kind of body has its own cap (RFC 9110 §15.5.14 Content Too Large; OWASP ASVS 4.0
 * V13.1.3 / V12.1.1 size limits):
 * - JSON: a basket change or a payment event is a few hundred bytes, so 64 KB;
 * - a multipart photo upload: the 12 MB a photo may be (photo-limits), plus the form's envelope;
 * - the booth's sync and orders: what those routes promise (1,000 sales or 2 MB).
 * A body declaring more is refused before the route runs; one sent without a length is capped
 * while it is read (`readJson` in read-json.ts). adapter-node's BODY_SIZE_LIMIT (16M) stays the outer bound.
 */
export const API_BODY_LIMIT = 64 * 1024;
export const TOO_LARGE = 'The request is too large: send at most 64 KB of JSON.';
/** Room for the multipart boundaries and the small text fields beside the file. */
const MULTIPART_ENVELOPE = 64 * 1024;
export const UPLOAD_BODY_LIMIT = MAX_PHOTO_BYTES + MULTIPART_ENVELOPE;
export const UPLOAD_TOO_LARGE = `A photo may be at most ${MAX_PHOTO_BYTES / 1024 / 1024} MB; export a smaller JPEG and send it again.`;
export const BOOTH_TOO_LARGE = `A batch may be at most ${BOOTH_MAX_BYTES / 1_000_000} MB; send the sales in smaller batches (nothing was stored).`;
/**
 * A refused body up to this size is read and thrown away before the answer, so the browser gets
 * the 413 and its message rather than a reset connection, and the keep-alive connection can
 * carry the next request. A larger one is answered at once with `Connection: close`.
 */
export const DRAIN_LIMIT = 32 * 1024 * 1024;

const BOOTH_ROUTE = /^\/api\/booth\/[^/]+\/(sales|orders)$/;

export type BodyLimit = { bytes: number; message: string };

/** The cap for a request to an /api/ path, by route and content type. */
export function bodyLimitFor(pathname: string, contentType: string | null): BodyLimit {
	if (BOOTH_ROUTE.test(pathname)) return { bytes: BOOTH_MAX_BYTES, message: BOOTH_TOO_LARGE };
	const type = (contentType ?? '').split(';', 1)[0].trim().toLowerCase();
	if (type === 'multipart/form-data')
		return { bytes: UPLOAD_BODY_LIMIT, message: UPLOAD_TOO_LARGE };
	return { bytes: API_BODY_LIMIT, message: TOO_LARGE };
}

/** Reads and discards what is left of a body, up to `max` bytes; true when it all arrived. */
export async function drainBody(request: Request, max = DRAIN_LIMIT): Promise<boolean> {
	if (!request.body || request.bodyUsed) return true;
	return drainReader(request.body.getReader(), max);
}

export async function drainReader(
	reader: ReadableStreamDefaultReader<Uint8Array>,
	max = DRAIN_LIMIT
): Promise<boolean> {
	let size = 0;
	try {
		for (;;) {
			const { done, value } = await reader.read();
			if (done) return true;
			size += value.byteLength;
			if (size > max) return false;
		}
	} catch {
		// The adapter's own limit or a dropped connection ended the stream.
		return false;
	} finally {
		reader.releaseLock();
	}
}

/** The 413 for a request whose declared length passes its route's cap; null when it fits. */
export function declaredTooLarge(request: Request, limit: BodyLimit): Response | null {
	const length = Number(request.headers.get('content-length') ?? 0);
	return length > limit.bytes ? apiError(413, limit.message) : null;
}

/**
 * Any answer given before the body was read (a 413, a 401, a refused form): the rest of the body
 * is read and thrown away when small enough, so the connection can carry the next request and the
 * browser reads the answer rather than a reset; a larger one gets `Connection: close`
 * (RFC 9112 §9.6: the server closes rather than parse leftover body bytes as a request).
 */
export async function settleUnreadBody(request: Request, response: Response): Promise<void> {
	if (!request.body || request.bodyUsed) return;
	const declared = Number(request.headers.get('content-length') ?? NaN);
	const drained =
		Number.isFinite(declared) && declared > DRAIN_LIMIT ? false : await drainBody(request);
	if (!drained) response.headers.set('connection', 'close');
}
