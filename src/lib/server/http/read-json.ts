import { DomainError } from '../errors/domain-error';
import { bodyLimitFor, drainReader } from './body-limit';

export const NOT_A_JSON_OBJECT = 'Send a JSON object.';

/**
 * The one JSON body reader of the API (the payment webhook alone reads its raw text, for the
 * signature). Counts bytes as they arrive against the route's own cap (`bodyLimitFor`: 64 KB,
 * or the booth's 2 MB) and answers through DomainError, so `orApiError` turns it into
 * `{ error }`: 413 with the cap's sentence when too large, 400 "Send a JSON object." when the body
 * is missing, not JSON, or JSON but not an object.
 */
export async function readJson(request: Request): Promise<Record<string, unknown>> {
	const limit = bodyLimitFor(new URL(request.url).pathname, request.headers.get('content-type'));
	const tooLarge = () => new DomainError(413, limit.message);
	const bad = () => new DomainError(400, NOT_A_JSON_OBJECT);
	if (Number(request.headers.get('content-length') ?? 0) > limit.bytes) throw tooLarge();
	if (!request.body) throw bad();
	const reader = request.body.getReader();
	const chunks: Uint8Array[] = [];
	let size = 0;
	try {
		for (;;) {
			const { done, value } = await reader.read();
			if (done) break;
			size += value.byteLength;
			if (size > limit.bytes) {
				// Read the rest rather than cancel: cancelling resets the connection under the client.
				await drainReader(reader);
				throw tooLarge();
			}
			chunks.push(value);
		}
	} catch (err) {
		if (err instanceof DomainError) throw err;
		// adapter-node's own BODY_SIZE_LIMIT ends the stream with a 413 error.
		if ((err as { status?: number }).status === 413) throw tooLarge();
		throw bad();
	}
	let value: unknown;
	try {
		value = JSON.parse(Buffer.concat(chunks).toString('utf8'));
	} catch {
		throw bad();
	}
	if (!value || typeof value !== 'object' || Array.isArray(value)) throw bad();
	return value as Record<string, unknown>;
}
