// s3rver 3.7 ships no types; only what mocks/s3/server.ts uses.
declare module 's3rver' {
	import type { AddressInfo } from 'node:net';
	type Options = {
		address?: string;
		port?: number;
		silent?: boolean;
		directory?: string;
		resetOnClose?: boolean;
		allowMismatchedSignatures?: boolean;
		vhostBuckets?: boolean;
		configureBuckets?: { name: string; configs?: (string | Buffer)[] }[];
	};
	export default class S3rver {
		constructor(options?: Options);
		run(): Promise<AddressInfo>;
		close(): Promise<void>;
	}
}
