/**
 * The shop's sales-tax setting as the basket and checkout use it: read from the real MariaDB
 * (inside a transaction that is rolled back, so no other test sees another rate), and applied by
 * `priceLines` on the basis the owner chose. The worked example is the one in
 * `$lib/tax/sales-tax` (SSUTA §324 rounding; see tax.test.ts): two pieces at 12.10, 7.25 %.
 */
import { describe, expect, it } from 'vitest';
import { db } from '$lib/server/db';
import { settings } from '$lib/server/db/schema';
import { getSalesTax } from '$lib/server/settings/sales-tax';
import { priceLines, type LineToPrice } from '$lib/server/cart/pricing';
import { DEFAULT_SCHEDULE } from '$lib/queue/carving-queue';

class Rollback extends Error {}

/** Reads the setting as stored with `value`, then undoes the write. */
async function readWith(value: unknown) {
	let read: Awaited<ReturnType<typeof getSalesTax>> | undefined;
	await db
		.transaction(async (tx) => {
			await tx.insert(settings).values({ key: 'salesTax', value }).onDuplicateKeyUpdate({
				set: { value }
			});
			read = await getSalesTax(tx);
			throw new Rollback();
		})
		.catch((e) => {
			if (!(e instanceof Rollback)) throw e;
		});
	return read!;
}

describe('the sales-tax setting in the database', () => {
	it('reads a rate saved before the basis existed as per line', async () => {
		expect(await readWith({ rateBp: 725 })).toEqual({ rateBp: 725, basis: 'item' });
	});

	it('reads the basis the owner chose', async () => {
		expect(await readWith({ rateBp: 600, basis: 'invoice' })).toEqual({
			rateBp: 600,
			basis: 'invoice'
		});
	});

	it('reads a malformed value as no tax rather than failing the basket', async () => {
		expect(await readWith({ rateBp: 'seven' })).toEqual({ rateBp: 0, basis: 'item' });
		expect(await readWith({ rateBp: 725, basis: 'per-piece' })).toEqual({
			rateBp: 725,
			basis: 'item'
		});
	});
});

describe('the basket priced on each basis', () => {
	/** A plain (not personalised) piece: only the price matters here. */
	const piece = (basePriceMinor: number): LineToPrice => ({
		quantity: 1,
		personalisation: null,
		kind: 'coaster',
		lengthMm: 100,
		widthMm: 100,
		thicknessMm: 10,
		basePriceMinor,
		pattern: {} as LineToPrice['pattern'],
		woodSlug: 'basswood',
		densityKgM3: 450,
		priceAddOnMinor: 0
	});
	const ctx = {
		rateBp: 725,
		schedule: DEFAULT_SCHEDULE,
		rates: [{ zone: 'domestic', upToGrams: 20_000, priceMinor: 895 }],
		country: 'US'
	};

	it('per line: 0.87725 → 0.88 twice, 1.76', () => {
		const p = priceLines([piece(1210), piece(1210)], { ...ctx, taxBasis: 'item' });
		expect(p.subtotalMinor).toBe(2420);
		expect(p.taxMinor).toBe(176);
		expect(p.totalMinor).toBe(2420 + 176 + p.shippingMinor);
	});

	it('once on the whole: 24.20 × 7.25 % = 1.7545 → 1.75', () => {
		const p = priceLines([piece(1210), piece(1210)], { ...ctx, taxBasis: 'invoice' });
		expect(p.taxMinor).toBe(175);
		expect(p.totalMinor).toBe(2420 + 175 + p.shippingMinor);
	});
});
