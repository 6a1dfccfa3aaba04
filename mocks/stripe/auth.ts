import { ApiError } from './errors';

/** Reads the secret key from `Authorization: Bearer sk_…` (or Basic with the key as user name). */
export function checkKey(header: string | undefined, expected: string) {
	let key = '';
	if (header?.startsWith('Bearer ')) key = header.slice(7).trim();
	else if (header?.startsWith('Basic '))
		key = Buffer.from(header.slice(6), 'base64').toString().split(':')[0];
	if (!key)
		throw new ApiError(
			401,
			'invalid_request_error',
			'You did not provide an API key. Provide it in the Authorization header as a Bearer token.'
		);
	if (key !== expected)
		throw new ApiError(
			401,
			'invalid_request_error',
			`Invalid API Key provided: ${key.slice(0, 8)}****${key.slice(-4)}`,
			'api_key_invalid'
		);
	return key;
}
