/**
 * The demo's fairs (invented): two past fairs with their load-out, booth sales, tally and close
 * — the Harvest Fair adds up, the Quarry Lane market does not (an ornament missing, the cash box
 * 5.00 short) — and the Riverbank Winter Market, open now with pieces loaded out.
 *
 * Every stock move goes through `adjustStock`, as in the app. For the past fairs the pieces that
 * sold (or went missing) are first carved into the workshop, so the shelf the rest of the demo
 * starts from is unchanged by them.
 */
import { and, eq } from 'drizzle-orm';
import * as schema from '../../src/lib/server/db/schema';
import { adjustStock, fairPlace } from '../../src/lib/server/stock/adjust';
import { priceSale } from '../../src/lib/booth/reconcile';
import { isoDay } from '../../src/lib/locale/dates';
import type { DemoExtra, SeedDb } from './types';

type Tx = Parameters<Parameters<SeedDb['transaction']>[0]>[0];
type Ids = {
	pieceIds: Record<string, number>;
	woodIds: Record<string, number>;
	userIds: Record<string, string>;
};
type Line = [piece: string, wood: string, quantity: number];
type Sale = { lines: Line[]; method: 'cash' | 'card' | 'other'; hour: number; discount?: number };

const DAY = 86_400_000;
const iso = isoDay;

type DemoFair = {
	fair: Omit<typeof schema.fairs.$inferInsert, 'startsOn' | 'endsOn'>;
	startDay: number;
	days: number;
	loaded: Line[];
	sales: Sale[];
	/** Pieces not counted back beyond what sold, per "piece/wood". */
	missing?: Record<string, number>;
	cashShortMinor?: number;
	closed: boolean;
};

const FAIRS: DemoFair[] = [
	{
		fair: {
			name: 'Linden Ford Harvest Fair',
			place: 'Mill Green, Linden Ford',
			boothFeeMinor: 12000,
			otherCostsMinor: 3500,
			salesTaxBp: 725,
			pricesIncludeTax: false,
			cashFloatMinor: 15000,
			cardFeeBp: 260,
			helperDiscountBp: 1000,
			openMinutes: 420,
			notes: 'Corner pitch by the cider press. Bring the second table cloth.'
		},
		startDay: -40,
		days: 1,
		loaded: [
			['rosette-ornament', 'basswood', 8],
			['trinket-box', 'basswood', 2],
			['coffee-scoop', 'cherry', 2]
		],
		sales: [
			{ lines: [['rosette-ornament', 'basswood', 2]], method: 'cash', hour: 10 },
			{ lines: [['trinket-box', 'basswood', 1]], method: 'card', hour: 11 },
			{
				lines: [
					['rosette-ornament', 'basswood', 1],
					['coffee-scoop', 'cherry', 1]
				],
				method: 'cash',
				hour: 13,
				discount: 200
			},
			{ lines: [['rosette-ornament', 'basswood', 2]], method: 'card', hour: 14 },
			{ lines: [['coffee-scoop', 'cherry', 1]], method: 'other', hour: 15 }
		],
		closed: true
	},
	{
		fair: {
			name: 'Quarry Lane Craft Market',
			place: 'Stone Barn, Quarry Lane, Ashby Cross',
			boothFeeMinor: 8500,
			otherCostsMinor: 2000,
			salesTaxBp: 650,
			pricesIncludeTax: true,
			cashFloatMinor: 10000,
			cardFeeBp: 275,
			helperDiscountBp: 1500,
			openMinutes: 900,
			notes: 'Two days indoors. Prices on the tags include the tax here.'
		},
		startDay: -12,
		days: 2,
		loaded: [
			['rosette-ornament', 'basswood', 6],
			['rosette-ornament', 'butternut', 3],
			['coffee-scoop', 'maple', 2]
		],
		sales: [
			{ lines: [['rosette-ornament', 'basswood', 1]], method: 'cash', hour: 10 },
			{ lines: [['rosette-ornament', 'butternut', 2]], method: 'card', hour: 11 },
			{ lines: [['coffee-scoop', 'maple', 1]], method: 'cash', hour: 12 },
			{ lines: [['rosette-ornament', 'basswood', 2]], method: 'card', hour: 15 },
			{ lines: [['rosette-ornament', 'basswood', 1]], method: 'cash', hour: 16, discount: 100 }
		],
		missing: { 'rosette-ornament/basswood': 1 },
		cashShortMinor: 500,
		closed: true
	},
	{
		fair: {
			name: 'Riverbank Winter Market',
			place: 'Old Granary, Linden Ford',
			boothFeeMinor: 18000,
			otherCostsMinor: 2500,
			salesTaxBp: 725,
			pricesIncludeTax: false,
			cashFloatMinor: 20000,
			cardFeeBp: 260,
			helperDiscountBp: 1000,
			openMinutes: 960,
			notes: 'Indoor, two days. Ornaments sell best here.'
		},
		startDay: 0,
		days: 2,
		loaded: [
			['rosette-ornament', 'basswood', 4],
			['rosette-ornament', 'butternut', 2],
			['trinket-box', 'walnut', 1],
			['coffee-scoop', 'maple', 1]
		],
		sales: [],
		closed: false
	}
];

export async function seedDemoFairs(tx: Tx, now: Date, ids: Ids) {
	const owner = ids.userIds['hollis@chipstall.test'] ?? null;
	const helper = ids.userIds['wren@chipstall.test'] || owner;
	for (const d of FAIRS) {
		const start = new Date(now.getTime() + d.startDay * DAY);
		const [{ id }] = await tx
			.insert(schema.fairs)
			.values({
				...d.fair,
				startsOn: iso(start),
				endsOn: iso(new Date(start.getTime() + (d.days - 1) * DAY))
			})
			.$returningId();
		// The demo helper sells at every demo fair (fairs have their own helpers).
		const demoHelper = ids.userIds['wren@chipstall.test'];
		if (demoHelper)
			await tx
				.insert(schema.fairHelpers)
				.values({ fairId: id, userId: demoHelper, addedAt: start });
		const key = (p: string, w: string) => `${p}/${w}`;
		const sold = new Map<string, number>();
		for (const s of d.sales)
			for (const [p, w, q] of s.lines) sold.set(key(p, w), (sold.get(key(p, w)) ?? 0) + q);
		const at = (hour: number) =>
			new Date(Date.UTC(start.getUTCFullYear(), start.getUTCMonth(), start.getUTCDate(), hour));

		for (const [p, w, q] of d.loaded) {
			const line = { pieceId: ids.pieceIds[p], woodId: ids.woodIds[w], userId: owner };
			const gone = (sold.get(key(p, w)) ?? 0) + (d.missing?.[key(p, w)] ?? 0);
			if (d.closed && gone > 0) {
				await adjustStock(tx, {
					...line,
					place: 'workshop',
					delta: gone,
					reason: `Carved for ${d.fair.name}`
				});
			}
			await adjustStock(tx, {
				...line,
				place: 'workshop',
				delta: -q,
				reason: `Loaded out to ${d.fair.name}`
			});
			await adjustStock(tx, {
				...line,
				place: fairPlace(id),
				delta: q,
				reason: `Loaded out to ${d.fair.name}`
			});
			await tx
				.insert(schema.fairStock)
				.values({ fairId: id, pieceId: line.pieceId, woodId: line.woodId, loadedOut: q });
		}

		let cash = 0;
		let card = 0;
		for (const [i, s] of d.sales.entries()) {
			const pieces = await Promise.all(
				s.lines.map(async ([p, w, q]) => {
					const [piece] = await tx
						.select()
						.from(schema.pieces)
						.where(eq(schema.pieces.id, ids.pieceIds[p]));
					const [wood] = await tx
						.select()
						.from(schema.woods)
						.where(eq(schema.woods.id, ids.woodIds[w]));
					return {
						pieceId: piece.id,
						woodId: wood.id,
						quantity: q,
						unitPriceMinor: piece.basePriceMinor + wood.priceAddOnMinor
					};
				})
			);
			const priced = priceSale(
				pieces.map((l) => ({ unitMinor: l.unitPriceMinor, quantity: l.quantity })),
				s.discount ?? 0,
				d.fair.salesTaxBp ?? 0,
				d.fair.pricesIncludeTax ?? false
			);
			const saleId = `demo-${id}-${String(i + 1).padStart(3, '0')}-${crypto.randomUUID().slice(0, 8)}`;
			const soldAt = at(s.hour);
			await tx.insert(schema.boothSales).values({
				id: saleId,
				fairId: id,
				kind: 'sale',
				method: s.method,
				lines: pieces,
				subtotalMinor: priced.subtotalMinor,
				discountMinor: priced.discountMinor,
				taxMinor: priced.taxMinor,
				totalMinor: priced.totalMinor,
				tenderedMinor: s.method === 'cash' ? Math.ceil(priced.totalMinor / 1000) * 1000 : null,
				soldAt,
				receivedAt: soldAt,
				recordedBy: helper
			});
			for (const l of pieces) {
				await adjustStock(tx, {
					pieceId: l.pieceId,
					woodId: l.woodId,
					place: fairPlace(id),
					delta: -l.quantity,
					reason: `Booth sale ${saleId}`,
					userId: helper
				});
			}
			if (s.method === 'cash') cash += priced.totalMinor;
			if (s.method === 'card') card += priced.totalMinor;
		}
		if (!d.closed) continue;

		const closeAt = at(18);
		// Every demo sale is on the fair's first day, so that day's cash-up holds them all.
		const [{ id: tallyId }] = await tx
			.insert(schema.tallies)
			.values({
				fairId: id,
				day: iso(start),
				cashCountedMinor: (d.fair.cashFloatMinor ?? 0) + cash - (d.cashShortMinor ?? 0),
				cashPaidOutMinor: 0,
				cardReportedMinor: card,
				createdBy: helper,
				createdAt: closeAt
			})
			.$returningId();
		for (const [p, w, q] of d.loaded) {
			const left = q - (sold.get(key(p, w)) ?? 0);
			const back = left - (d.missing?.[key(p, w)] ?? 0);
			const line = { pieceId: ids.pieceIds[p], woodId: ids.woodIds[w], userId: owner };
			if (back > 0) {
				await adjustStock(tx, {
					...line,
					place: fairPlace(id),
					delta: -back,
					reason: `Back from ${d.fair.name}`
				});
				await adjustStock(tx, {
					...line,
					place: 'workshop',
					delta: back,
					reason: `Back from ${d.fair.name}`
				});
			}
			if (left - back > 0) {
				await adjustStock(tx, {
					...line,
					place: fairPlace(id),
					delta: -(left - back),
					reason: `Missing at the ${d.fair.name} tally`
				});
			}
			const where = and(
				eq(schema.fairStock.fairId, id),
				eq(schema.fairStock.pieceId, line.pieceId),
				eq(schema.fairStock.woodId, line.woodId)
			);
			await tx.update(schema.fairStock).set({ countedBack: back, returned: back }).where(where);
			const [fs] = await tx.select({ id: schema.fairStock.id }).from(schema.fairStock).where(where);
			await tx.insert(schema.tallyCounts).values({ tallyId, fairStockId: fs.id, counted: back });
		}
		await tx.update(schema.fairs).set({ closedAt: closeAt }).where(eq(schema.fairs.id, id));
	}
}

/**
 * At the open Riverbank Winter Market a buyer ordered a keepsake box in cherry with her initials
 * and left a cash deposit: the orders module writes it as the booth would, so the workshop shows
 * a deposit order with the balance still to pay. Runs after the demo is committed (the orders
 * module uses the `$lib` alias, loaded when it runs), before the queue dates the orders.
 */
export const demoBoothOrder: DemoExtra = {
	name: 'a booth order with a deposit',
	run: async (db, seeded) => {
		const { placeBoothOrder } = await import('../../src/lib/server/orders/booth');
		const [fair] = await db
			.select()
			.from(schema.fairs)
			.where(eq(schema.fairs.name, 'Riverbank Winter Market'));
		if (!fair) return;
		const [piece] = await db
			.select()
			.from(schema.pieces)
			.where(eq(schema.pieces.id, seeded.pieceIds['keepsake-box']));
		const [wood] = await db
			.select()
			.from(schema.woods)
			.where(eq(schema.woods.id, seeded.woodIds['cherry']));
		const helper = seeded.userIds['wren@chipstall.test'] ?? null;
		const at = new Date(Date.now() - 2 * 3600_000);
		const deposit = 2000;
		await db.transaction(async (tx) => {
			const order = await placeBoothOrder(tx, {
				piece,
				wood,
				initials: 'MQ',
				buyer: {
					name: 'Marisol Quill',
					email: 'marisol.quill@example.test',
					address: { line1: '14 Ferry Lane', city: 'Linden Ford', postcode: '80344', country: 'US' }
				},
				fair,
				depositMinor: deposit,
				delivery: 'collect',
				rates: [],
				takenBy: helper,
				now: at
			});
			// The deposit counts in the fair's cash box like the booth's own entry would.
			await tx.insert(schema.boothSales).values({
				id: 'demo-riverbank-deposit-1',
				fairId: fair.id,
				kind: 'deposit',
				method: 'cash',
				lines: [],
				subtotalMinor: deposit,
				totalMinor: deposit,
				soldAt: at,
				receivedAt: at,
				recordedBy: helper,
				orderId: order.id
			});
		});
	}
};
