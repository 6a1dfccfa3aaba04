/**
 * Backup and restore of everything the shop keeps: the database as one consistent dump
 * (`mariadb-dump --single-transaction`, so the shop keeps serving while it runs) and every
 * object in the photo bucket. Used by `npm run backup`, `npm run restore` and their test.
 */
import { spawn } from 'node:child_process';
import {
	createReadStream,
	createWriteStream,
	existsSync,
	mkdirSync,
	readdirSync,
	statSync
} from 'node:fs';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import type { Readable } from 'node:stream';
import { GetObjectCommand, ListObjectsV2Command, PutObjectCommand } from '@aws-sdk/client-s3';
import { config } from '../../config/settings';
import { s3 } from '../../src/lib/server/catalogue/photo-storage';

const bin = (name: string) =>
	['/usr/bin', '/usr/sbin', '/bin'].map((d) => path.join(d, name)).find(existsSync) ?? name;

function clientArgs(url: string): string[] {
	const u = new URL(url);
	return [
		'--no-defaults',
		`--host=${u.hostname}`,
		`--port=${u.port || 3306}`,
		`--user=${decodeURIComponent(u.username)}`,
		`--password=${decodeURIComponent(u.password)}`
	];
}
const dbName = (url: string) => new URL(url).pathname.slice(1);

function runTo(cmd: string, args: string[], io: { stdin?: string; stdout?: string }) {
	return new Promise<void>((resolve, reject) => {
		const child = spawn(cmd, args, { stdio: ['pipe', 'pipe', 'pipe'] });
		let err = '';
		child.stderr.on('data', (c: Buffer) => (err += c.toString()));
		if (io.stdout) child.stdout.pipe(createWriteStream(io.stdout));
		if (io.stdin) createReadStream(io.stdin).pipe(child.stdin);
		else child.stdin.end();
		child.once('error', reject);
		child.once('exit', (code) =>
			code === 0 ? resolve() : reject(new Error(`${path.basename(cmd)} failed (${code}): ${err}`))
		);
	});
}

/** Writes `<dir>/database.sql` and `<dir>/photos/<key>`; returns the number of photo objects. */
export async function backup(url: string, dir: string): Promise<{ photos: number }> {
	mkdirSync(path.join(dir, 'photos'), { recursive: true });
	await runTo(
		bin('mariadb-dump'),
		[
			...clientArgs(url),
			'--single-transaction',
			'--routines',
			'--triggers',
			'--hex-blob',
			dbName(url)
		],
		{ stdout: path.join(dir, 'database.sql') }
	);
	let photos = 0;
	let token: string | undefined;
	do {
		const page = await s3().send(
			new ListObjectsV2Command({ Bucket: config.s3.bucket, ContinuationToken: token })
		);
		for (const o of page.Contents ?? []) {
			const file = path.join(dir, 'photos', o.Key!);
			mkdirSync(path.dirname(file), { recursive: true });
			const obj = await s3().send(new GetObjectCommand({ Bucket: config.s3.bucket, Key: o.Key! }));
			await pipeline(obj.Body as Readable, createWriteStream(file));
			photos++;
		}
		token = page.IsTruncated ? page.NextContinuationToken : undefined;
	} while (token);
	return { photos };
}

function filesUnder(dir: string): string[] {
	if (!existsSync(dir)) return [];
	return readdirSync(dir).flatMap((f) => {
		const p = path.join(dir, f);
		return statSync(p).isDirectory() ? filesUnder(p) : [p];
	});
}

/** Loads `<dir>/database.sql` into the (empty) database at `url` and puts the photos back. */
export async function restore(url: string, dir: string): Promise<{ photos: number }> {
	await runTo(bin('mariadb'), [...clientArgs(url), dbName(url)], {
		stdin: path.join(dir, 'database.sql')
	});
	// The dump loads its rows before its triggers, and its counter row as it was: bump it once
	// more, so every running app process drops pages cached before the restore.
	await runTo(
		bin('mariadb'),
		[...clientArgs(url), dbName(url), '-e', 'UPDATE catalogue_version SET n = n + 1 WHERE id = 1'],
		{}
	);
	const root = path.join(dir, 'photos');
	const files = filesUnder(root);
	for (const file of files) {
		const key = path.relative(root, file).split(path.sep).join('/');
		await s3().send(
			new PutObjectCommand({
				Bucket: config.s3.bucket,
				Key: key,
				Body: createReadStream(file),
				ContentLength: statSync(file).size,
				ContentType: key.endsWith('.webp') ? 'image/webp' : undefined
			})
		);
	}
	return { photos: files.length };
}
