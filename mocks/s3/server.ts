/**
 * S3 stand-in: s3rver on loopback with the photo bucket created at start. Data lives in
 * `.data/s3` (git-ignored) unless S3_DIR points elsewhere (the tests use a temp dir).
 */
import fs from 'node:fs';
import path from 'node:path';
import S3rver from 's3rver';
import { config } from '../../config/settings';
import { isMain, runUntilSignal } from '../run';

export type S3ServerOptions = {
	port?: number;
	directory?: string;
	bucket?: string;
};

export async function startS3Server(opts: S3ServerOptions = {}) {
	const directory = opts.directory ?? process.env.S3_DIR ?? path.resolve('.data/s3');
	fs.mkdirSync(directory, { recursive: true });
	const server = new S3rver({
		address: '127.0.0.1',
		port: opts.port ?? config.s3.port,
		directory,
		silent: true,
		// Path-style only: the app's client sets forcePathStyle, and loopback has no bucket subdomains.
		vhostBuckets: false,
		configureBuckets: [{ name: opts.bucket ?? config.s3.bucket }]
	});
	const address = await server.run();
	return { port: address.port, directory, close: () => server.close() };
}

if (isMain(import.meta.url)) {
	runUntilSignal('s3', async () => {
		const s = await startS3Server();
		console.log(`s3 stand-in: http://127.0.0.1:${s.port}/ (data in ${s.directory})`);
		return s;
	});
}
