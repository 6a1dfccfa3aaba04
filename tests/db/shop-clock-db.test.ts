/**
 * Booth sales near midnight on the real database: the booth's "today", the report by hour and the
 * CSV all use the shop's zone (America/New_York, the demo's; EDT is UTC−4 in June per the IANA tz
 * database), and the CSV's times are ISO 8601 local time with offset.
 */
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoStaff, testPiece, testStock, testWood } from '../helpers/fixtures';
import { createFair } from '$lib/server/fairs/fairs';
import { loadOut } from '$lib/server/fairs/load-out';
import { syncSales } from '$lib/server/booth/sync';
import { boothView } from '$lib/server/booth/view';
import { fairCsv, fairReport } from '$lib/server/booth/fair-report';
import { fairFormSchema } from '$lib/fairs/schemas';
import { DEFAULT_FORMAT, useShopFormat } from '$lib/locale/shop-format';

const tag = `clk${process.pid}${Date.now() % 100000}`;
const pieceSlug = `${tag}-orn`;
const woodSlug = `${tag}-wood`;
let fairId = 0;
let owner: { id: string; role: 'owner' };

const sale = (n: number, at: string) => ({
	id: `${tag}-sale-${n}`,
	at,
	lines: [{ pieceSlug, woodSlug, quantity: 1 }],
	discountMinor: 0,
	method: 'cash',
	tenderedMinor: 5000
});

beforeAll(async () => {
	useShopFormat({ timeZone: 'America/New_York', locale: 'en-US', currency: 'USD' });
	const woodId = await testWood(woodSlug, { name: 'Test basswood' });
	const pieceId = await testPiece(pieceSlug, [woodId], {
		title: 'Test ornament',
		kind: 'ornament',
		personalisable: false
	});
	await testStock(pieceId, woodId, 10);
	const { owner: o } = await demoStaff();
	owner = o;
	fairId = await createFair(
		fairFormSchema.parse({
			name: `${tag} night market`,
			place: 'Test Hall',
			startsOn: '2026-06-06',
			endsOn: '2026-06-07',
			boothFee: '0',
			otherCosts: '',
			salesTax: '0',
			cashFloat: '50',
			cardFee: '0',
			helperDiscount: '10',
			openHours: '8'
		})
	);
	await loadOut(fairId, [{ pieceId, woodId, quantity: 5 }], owner.id);
	const r = await syncSales(
		fairId,
		[
			// Saturday June 6, 22:10 and 23:30 EDT; then Sunday June 7, 00:30 EDT.
			sale(1, '2026-06-07T02:10:00Z'),
			sale(2, '2026-06-07T03:30:00Z'),
			sale(3, '2026-06-07T04:30:00Z')
		],
		owner
	);
	expect(r.rejected).toEqual([]);
});
afterAll(() => useShopFormat(DEFAULT_FORMAT));

describe('a booth sale at 23:30 in the workshop zone', () => {
	it("counts on that day in the booth's today", async () => {
		const sat = await boothView(fairId, true, '2026-06-06');
		const sun = await boothView(fairId, true, '2026-06-07');
		const cash = (v: typeof sat) => v.day.find((d) => d.method === 'cash')!;
		expect(cash(sat)).toMatchObject({ count: 2, totalMinor: 4000 });
		expect(cash(sun)).toMatchObject({ count: 1, totalMinor: 2000 });
	});

	it('charts by the hour on the shop clock and exports local time with its offset', async () => {
		const r = await fairReport(fairId);
		expect(r.byHour).toEqual([
			{ hour: 0, totalMinor: 2000 },
			{ hour: 22, totalMinor: 2000 },
			{ hour: 23, totalMinor: 2000 }
		]);
		const rows = Papa.parse<Record<string, string>>(fairCsv(r), { header: true }).data.filter(
			(row) => row.id
		);
		expect(rows.map((row) => row.sold_at).sort()).toEqual([
			'2026-06-06T22:10:00-04:00',
			'2026-06-06T23:30:00-04:00',
			'2026-06-07T00:30:00-04:00'
		]);
		// Still the same moments: the offset gets back to the stored UTC time.
		expect(rows.map((row) => new Date(row.sold_at).toISOString()).sort()).toEqual([
			'2026-06-07T02:10:00.000Z',
			'2026-06-07T03:30:00.000Z',
			'2026-06-07T04:30:00.000Z'
		]);
	});
});
