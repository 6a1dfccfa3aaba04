/**
 * Backup and restore, as the README's steps run them: the demo database dumped with
 * mariadb-dump --single-transaction and the photos copied, then loaded into a fresh database.
 * The restored copy must match exactly: the row count of every table, and a SHA-256 over every
 * column of every order (the rows as MariaDB itself returns them, in id order).
 */
import { createHash } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import mysql from 'mysql2/promise';
import { afterAll, describe, expect, it } from 'vitest';
import { config } from '$lib/server/config';
import { backup, restore } from '../../scripts/lib/backup';

const source = config.db.url;
const copyName = `chipstall_restore_${process.pid}`;
const copyUrl = (() => {
	const u = new URL(source);
	u.pathname = `/${copyName}`;
	return u.toString();
})();
const dir = mkdtempSync(path.join(tmpdir(), 'chipstall-backup-'));

async function fingerprint(url: string) {
	const conn = await mysql.createConnection(url);
	try {
		const [tables] = (await conn.query('show tables')) as unknown as [Record<string, string>[]];
		const counts: Record<string, number> = {};
		for (const t of tables.map((r) => Object.values(r)[0]).sort()) {
			const [[row]] = (await conn.query(`select count(*) as n from \`${t}\``)) as unknown as [
				{ n: number }[]
			];
			counts[t] = Number(row.n);
		}
		const [orders] = (await conn.query({
			sql: 'select * from orders order by id',
			rowsAsArray: true
		})) as unknown as [unknown[][]];
		const orderSum = createHash('sha256').update(JSON.stringify(orders)).digest('hex');
		return { counts, orderSum, orders: orders.length };
	} finally {
		await conn.end();
	}
}

afterAll(async () => {
	const conn = await mysql.createConnection(source);
	await conn.query(`drop database if exists \`${copyName}\``);
	await conn.end();
	rmSync(dir, { recursive: true, force: true });
});

describe('backup and restore', () => {
	it('brings the demo data back exactly in a fresh database', async () => {
		const { photos } = await backup(source, dir);
		const before = await fingerprint(source);
		expect(before.orders).toBeGreaterThanOrEqual(12); // the demo's dozen orders at least
		expect(photos).toBeGreaterThan(0);

		const conn = await mysql.createConnection(source);
		await conn.query(
			`create database \`${copyName}\` character set utf8mb4 collate utf8mb4_unicode_ci`
		);
		await conn.end();
		const restored = await restore(copyUrl, dir);
		expect(restored.photos).toBe(photos);

		const after = await fingerprint(copyUrl);
		expect(after.counts).toEqual(before.counts);
		expect(after.orderSum).toBe(before.orderSum);
	}, 120_000);
});
