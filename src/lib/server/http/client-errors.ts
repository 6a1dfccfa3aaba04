import http from 'node:http';

/**
 * Node answers a request whose request line and headers pass 16 KB (a 100 KB query string, say)
 * with a bare `431` and no body, before SvelteKit ever sees it. This gives every HTTP server the
 * process makes a `clientError` listener that says what is wrong in JSON instead (RFC 6585 §5:
 * 431 Request Header Fields Too Large), and otherwise does what Node does by default.
 */
const STATUS: Record<string, [number, string, string]> = {
	HPE_HEADER_OVERFLOW: [
		431,
		'Request Header Fields Too Large',
		'The address or headers are too long. Send a shorter query (under 8,000 characters).'
	],
	HPE_CHUNK_EXTENSIONS_OVERFLOW: [413, 'Payload Too Large', 'The request is too large.'],
	ERR_HTTP_REQUEST_TIMEOUT: [408, 'Request Timeout', 'The request took too long to arrive.']
};

export function onClientError(err: NodeJS.ErrnoException, socket: import('node:stream').Duplex) {
	const s = socket as import('node:net').Socket & { _httpMessage?: { headersSent?: boolean } };
	if (err.code === 'ECONNRESET' || !s.writable || s._httpMessage?.headersSent) {
		s.destroy(err);
		return;
	}
	const [status, reason, message] = STATUS[err.code ?? ''] ?? [
		400,
		'Bad Request',
		'The request could not be read.'
	];
	const body = JSON.stringify({ error: message });
	s.end(
		`HTTP/1.1 ${status} ${reason}\r\n` +
			'Content-Type: application/json\r\n' +
			`Content-Length: ${Buffer.byteLength(body)}\r\n` +
			'X-Content-Type-Options: nosniff\r\n' +
			'Connection: close\r\n\r\n' +
			body
	);
}

let installed = false;
/** Runs before adapter-node creates its server (the `init` hook runs while its handler loads). */
export function answerClientErrorsWithJson(): void {
	if (installed) return;
	installed = true;
	const create = http.createServer;
	http.createServer = ((...args: Parameters<typeof http.createServer>) => {
		const server = create(...args);
		server.on('clientError', onClientError);
		return server;
	}) as typeof http.createServer;
}
