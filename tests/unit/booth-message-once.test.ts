import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import {
	boothSaleSchema,
	syncAnswerSchema,
	type SalePayload,
	type SyncAnswer
} from '$lib/booth/sync-message';

/**
 * The booth's sync message (the sales the phone sends, the answer the server gives, the void,
 * order and discard entries) is typed once, in $lib/booth/sync-message, and read from there by
 * the phone's outbox and sync and by the server's booth code. This keeps a second hand-written
 * copy from coming back on either side.
 */
const src = path.resolve(__dirname, '../../src');
const dirs = ['lib/booth', 'lib/server/booth', 'lib/fairs', 'routes/api/booth'];

function files(dir: string): string[] {
	return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
		const p = path.join(dir, e.name);
		return e.isDirectory() ? files(p) : /\.(ts|svelte)$/.test(e.name) ? [p] : [];
	});
}

// What a second copy would have to spell out again.
const copies = [
	/\baccepted\s*:\s*string\[\]/,
	/\brejected\s*:\s*\{\s*id\s*:/,
	/type\s+(SalePayload|SyncAnswer|BoothSale|BoothVoid|BoothOrder)\s*=/,
	/\bboothSaleSchema\s*=/,
	/\bBOOTH_(CHUNK|MAX)\w*\s*=/
];

describe('the booth sync message is typed once', () => {
	it('no file besides sync-message declares it again', () => {
		const found = dirs
			.flatMap((d) => files(path.join(src, d)))
			.filter((f) => !f.endsWith(path.join('booth', 'sync-message.ts')))
			.flatMap((f) => {
				const text = readFileSync(f, 'utf8');
				return copies.filter((re) => re.test(text)).map((re) => `${path.relative(src, f)}: ${re}`);
			});
		expect(found).toEqual([]);
	});

	it('the phone and the server import it from there', () => {
		const read = (f: string) => readFileSync(path.join(src, f), 'utf8');
		expect(read('lib/booth/outbox.ts')).toMatch(/from '\.\/sync-message'/);
		expect(read('lib/booth/sync.ts')).toMatch(/from '\.\/sync-message'/);
		expect(read('lib/server/booth/sync.ts')).toMatch(/from '\$lib\/booth\/sync-message'/);
	});

	it('a sale as the phone builds it is what the server takes', () => {
		const payload: SalePayload = {
			id: 'phone-made-1',
			at: '2026-12-05T10:00:00Z',
			lines: [{ pieceSlug: 'rosette', woodSlug: 'basswood', quantity: 2 }],
			method: 'cash',
			tenderedMinor: 2000
		};
		const taken = boothSaleSchema.parse(payload);
		// The discount the phone may leave out is none, not unknown.
		expect(taken.discountMinor).toBe(0);
		expect(taken.lines).toEqual(payload.lines);
	});

	it('the answer the phone reads refuses a shape the server does not write', () => {
		const answer: SyncAnswer = { accepted: ['a'], duplicate: [], late: [], rejected: [] };
		expect(syncAnswerSchema.parse(answer)).toEqual(answer);
		expect(syncAnswerSchema.safeParse({ accepted: ['a'], rejected: [] }).success).toBe(false);
	});
});
