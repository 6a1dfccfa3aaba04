import { apiError } from './api-errors';

/**
 * The JSON API takes small bodies: a basket change or a payment event is a few hundred bytes.
 * Anything declaring more is refused before it is read, with 413 and a plain message
 * (RFC 9110 §15.5.14 Content Too Large; OWASP ASVS 4.0 V13.1.3 / V12.1.1 size limits).
 * A body sent without a length is capped while it is read (readJsonObject).
 */
export const API_BODY_LIMIT = 64 * 1024;
export const TOO_LARGE = 'The request is too large: send at most 64 KB of JSON.';

export function declaredTooLarge(request: Request, limit = API_BODY_LIMIT): Response | null {
	const length = Number(request.headers.get('content-length') ?? 0);
	return length > limit ? apiError(413, TOO_LARGE) : null;
}

export type JsonBody =
	{ ok: true; value: Record<string, unknown> } | { ok: false; status: 400 | 413; message: string };

/** Reads a JSON object, counting bytes as they arrive. */
export async function readJsonObject(request: Request, limit = API_BODY_LIMIT): Promise<JsonBody> {
	const bad = { ok: false, status: 400, message: 'Send a JSON object.' } as const;
	if (!request.body) return bad;
	const reader = request.body.getReader();
	const chunks: Uint8Array[] = [];
	let size = 0;
	try {
		for (;;) {
			const { done, value } = await reader.read();
			if (done) break;
			size += value.byteLength;
			if (size > limit) {
				await reader.cancel();
				return { ok: false, status: 413, message: TOO_LARGE };
			}
			chunks.push(value);
		}
	} catch (err) {
		// adapter-node's own BODY_SIZE_LIMIT ends the stream with a 413 error.
		if ((err as { status?: number }).status === 413)
			return { ok: false, status: 413, message: TOO_LARGE };
		return bad;
	}
	try {
		const v: unknown = JSON.parse(Buffer.concat(chunks).toString('utf8'));
		return v && typeof v === 'object' && !Array.isArray(v)
			? { ok: true, value: v as Record<string, unknown> }
			: bad;
	} catch {
		return bad;
	}
}
