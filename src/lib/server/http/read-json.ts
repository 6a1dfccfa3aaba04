import { BOOTH_MAX_BYTES } from '$lib/booth/sync-message';
import { FairError } from '../booth/errors';
import { BOOTH_TOO_LARGE } from './body-limit';

/** Reads a JSON body of at most BOOTH_MAX_BYTES, with a plain reason when it is too big or broken. */
export async function readBoothJson(request: Request): Promise<unknown> {
	const tooBig = () => new FairError(BOOTH_TOO_LARGE, 413);
	const declared = Number(request.headers.get('content-length') ?? '0');
	if (declared > BOOTH_MAX_BYTES) throw tooBig();
	const text = await request.text();
	if (Buffer.byteLength(text) > BOOTH_MAX_BYTES) throw tooBig();
	try {
		return JSON.parse(text);
	} catch {
		throw new FairError('The body is not valid JSON.');
	}
}
