/**
 * The demo scenario, an invented one: Hollis Marsh carves at the "Chipstall" workshop in the
 * (invented) town of Linden Ford, sells online and at two fairs, helped by Wren. Woods carry
 * their published Wood Handbook values (see src/lib/woods.ts).
 *
 * Relative imports only: `npm start`, `npm test` and the seed script load this through tsx,
 * outside SvelteKit's `$lib` alias.
 */
import { count } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/mysql2';
import mysql from 'mysql2/promise';
import { hashPassword } from '../auth/password';
import * as schema from '../db/schema';
import type { OrderStatus, Role } from '../db/schema';
import type { PieceKind } from '$lib/kinds';
import {
	snapshotInput,
	snapshotOf,
	styledLayout,
	type Personalisation,
	type PiecePattern
} from '../../pattern/snapshot';
import { WOODS, densityAt12 } from '../../woods';
import { demoExtras, type DemoSeedResult, type SeedDb } from './extras';
import { seedSettings } from './settings';
import { computePattern } from '../../pattern';
import { seedDemoFairs } from './fairs';

/** The snapshot the shop would have stored for these initials (same fields, same engine). */
function demoSnapshot(
	piece: { pattern: PiecePattern; size: number[] },
	woodSlug: string,
	initials: string
): Personalisation {
	const style = piece.pattern.split ? 'split' : 'classic';
	const layout = styledLayout(piece.pattern, style, initials);
	const [lengthMm, widthMm, thicknessMm] = piece.size;
	const result = computePattern(
		snapshotInput(layout, { widthMm, lengthMm, thicknessMm }, woodSlug),
		{
			svg: false
		}
	);
	return snapshotOf(layout, style, result);
}

/** Demo-only accounts, listed in the README and printed by `npm start`. */
export const DEMO_ACCOUNTS: { email: string; password: string; name: string; role: Role }[] = [
	{
		email: 'hollis@chipstall.test',
		password: 'demo-owner-2026',
		name: 'Hollis Marsh',
		role: 'owner'
	},
	{
		email: 'wren@chipstall.test',
		password: 'demo-helper-2026',
		name: 'Wren Tolliver',
		role: 'helper'
	},
	{
		email: 'juniper@example.test',
		password: 'demo-customer-2026',
		name: 'Juniper Vale',
		role: 'customer'
	}
];

/** Price add-on per wood over the base price (USD cents): harder woods take longer to carve. */
const WOOD_ADD_ON: Record<string, number> = {
	basswood: 0,
	butternut: 400,
	cherry: 800,
	walnut: 1200,
	maple: 1000
};

type DemoPiece = {
	slug: string;
	title: string;
	kind: PieceKind;
	summary: string;
	description: string;
	size: [number, number, number];
	basePriceMinor: number;
	personalisable: boolean;
	foodContact: boolean;
	leadDays: number;
	pattern: PiecePattern;
	woods: string[];
	/** Finished pieces on the workshop shelf, by wood. */
	stock: Record<string, number>;
};

export const DEMO_PIECES: DemoPiece[] = [
	{
		slug: 'rosette-bottle-holder',
		title: 'Rosette bottle holder',
		kind: 'bottle_holder',
		summary: 'A balancing bottle holder with one six-petal rosette and your initials.',
		description:
			'Cut from one board, the holder balances a wine bottle at an angle through the hole at its top. ' +
			'A single rosette sits below the neck; personalised pieces carry the initials in its centre.',
		size: [290, 95, 19],
		basePriceMinor: 4800,
		personalisable: true,
		foodContact: false,
		leadDays: 14,
		pattern: { diameterMm: 60, count: 1, spacingMm: 0, split: false },
		woods: ['basswood', 'butternut', 'cherry', 'walnut'],
		stock: { basswood: 3, cherry: 1 }
	},
	{
		slug: 'twin-rosette-bottle-holder',
		title: 'Twin-rosette bottle holder',
		kind: 'bottle_holder',
		summary:
			'A longer bottle holder with two rosettes overlapping by a radius, initials at the heart.',
		description:
			'Made for couples and house-warmings: two rosettes laid out along the board so the second ' +
			"starts where the first one's circle crosses the centre line, with the initials in the first.",
		size: [330, 105, 19],
		basePriceMinor: 5800,
		personalisable: true,
		foodContact: false,
		leadDays: 16,
		pattern: { diameterMm: 50, count: 2, spacingMm: 25, split: false },
		woods: ['basswood', 'cherry', 'walnut'],
		stock: { basswood: 1 }
	},
	{
		slug: 'welcome-plate',
		title: 'Welcome plate',
		kind: 'plate',
		summary: 'A round wall plate with a large rosette of halved chips and your initials.',
		description:
			'A turned basswood plate for the wall by the door. Every chip of the large rosette is ' +
			'halved along its axis for a finer, lacier look, with the initials at its heart. Not for food.',
		size: [250, 250, 18],
		basePriceMinor: 6500,
		personalisable: true,
		foodContact: false,
		leadDays: 21,
		pattern: { diameterMm: 140, count: 1, spacingMm: 0, split: true },
		woods: ['basswood', 'butternut'],
		stock: { basswood: 2 }
	},
	{
		slug: 'rim-rosette-serving-plate',
		title: 'Serving plate with a rosette band',
		kind: 'plate',
		summary: 'A shallow serving plate with a band of small overlapping rosettes, food-safe finish.',
		description:
			'The centre is left plain for bread and cheese; a band of five small overlapping rosettes ' +
			'runs across the top. ' +
			'Finished with a fully cured food-safe oil. Hand wash, dry, and re-oil now and then.',
		size: [280, 280, 20],
		basePriceMinor: 7200,
		personalisable: true,
		foodContact: true,
		leadDays: 21,
		pattern: { diameterMm: 36, count: 5, spacingMm: 18, split: false },
		woods: ['cherry', 'maple', 'walnut'],
		stock: { cherry: 1, maple: 1 }
	},
	{
		slug: 'keepsake-box',
		title: 'Keepsake box',
		kind: 'box',
		summary: 'A lidded box with a rosette on the lid and initials in its centre.',
		description:
			'A basswood box with a fitted lift-off lid. The lid carries one rosette; personalised ' +
			'boxes have the initials carved in its centre. Lined with felt.',
		size: [160, 110, 65],
		basePriceMinor: 8500,
		personalisable: true,
		foodContact: false,
		leadDays: 18,
		pattern: { diameterMm: 70, count: 1, spacingMm: 0, split: false },
		woods: ['basswood', 'butternut', 'cherry'],
		stock: { basswood: 2, butternut: 1 }
	},
	{
		slug: 'trinket-box',
		title: 'Trinket box',
		kind: 'box',
		summary: 'A small square box for rings and coins, a rosette on the lid.',
		description: 'A small square box with a sliding lid and a six-petal rosette. Ready to ship.',
		size: [95, 95, 50],
		basePriceMinor: 4200,
		personalisable: false,
		foodContact: false,
		leadDays: 5,
		pattern: { diameterMm: 55, count: 1, spacingMm: 0, split: false },
		woods: ['basswood', 'walnut'],
		stock: { basswood: 4, walnut: 2 }
	},
	{
		slug: 'rosette-ornament',
		title: 'Rosette ornament',
		kind: 'ornament',
		summary: 'A thin round ornament with a rosette and a year or initials on the back.',
		description:
			'Thin basswood disc with a six-petal rosette, a ribbon through the top. Light enough for ' +
			'any tree; a favourite at the winter fairs.',
		size: [75, 75, 6],
		basePriceMinor: 1400,
		personalisable: true,
		foodContact: false,
		leadDays: 7,
		pattern: { diameterMm: 60, count: 1, spacingMm: 0, split: false },
		woods: ['basswood', 'butternut'],
		stock: { basswood: 12, butternut: 4 }
	},
	{
		slug: 'coffee-scoop',
		title: 'Coffee scoop',
		kind: 'spoon',
		summary: 'A carved coffee scoop with a small rosette on the handle.',
		description:
			'One level scoop holds enough ground coffee for a cup. A small rosette sits on the flat ' +
			'of the handle, away from the bowl. Finished with a fully cured food-safe oil.',
		size: [150, 40, 16],
		basePriceMinor: 2400,
		personalisable: false,
		foodContact: true,
		leadDays: 7,
		pattern: { diameterMm: 18, count: 1, spacingMm: 0, split: false },
		woods: ['cherry', 'maple'],
		stock: { cherry: 3, maple: 2 }
	}
];

/** Flat-rate parcels by weight band (USD cents), invented for the demo. */
export const DEMO_SHIPPING_RATES: { zone: string; upToGrams: number; priceMinor: number }[] = [
	...(
		[
			['domestic', [895, 1195, 1595, 2295]],
			['north_america', [1895, 2495, 3295, 4995]],
			['world', [2495, 3495, 4995, 7995]]
		] as const
	).flatMap(([zone, prices]) =>
		[500, 1000, 2000, 5000].map((upToGrams, i) => ({ zone, upToGrams, priceMinor: prices[i] }))
	)
];

const DAY = 86_400_000;
const daysFromNow = (d: number, now: Date) => new Date(now.getTime() + d * DAY);
const isoDate = (d: Date) => d.toISOString().slice(0, 10);

type DemoOrder = {
	ref: string;
	buyer: string;
	email: string;
	customer?: boolean;
	address: schema.Address;
	status: OrderStatus;
	daysAgo: number;
	lines: {
		piece: string;
		wood: string;
		quantity: number;
		initials?: string;
		fromStock?: boolean;
	}[];
	shipment?: { carrier: string; trackingNumber: string; daysAgo: number };
	giftNote?: string;
};

const addr = (line1: string, city: string, region: string, postcode: string, country = 'US') => ({
	line1,
	city,
	region,
	postcode,
	country
});

export const DEMO_ORDERS: DemoOrder[] = [
	{
		ref: 'CS-1001',
		buyer: 'Juniper Vale',
		email: 'juniper@example.test',
		customer: true,
		address: addr('14 Orchard Row', 'Alder Bend', 'VT', '05001'),
		status: 'shipped',
		daysAgo: 40,
		lines: [{ piece: 'rosette-bottle-holder', wood: 'cherry', quantity: 1, initials: 'JV' }],
		shipment: { carrier: 'USPS', trackingNumber: 'DEMO9400100000000000001', daysAgo: 24 }
	},
	{
		ref: 'CS-1002',
		buyer: 'Tobias Reyne',
		email: 'tobias@example.test',
		address: addr('3 Quarry Lane', 'Hatchley', 'NH', '03101'),
		status: 'shipped',
		daysAgo: 33,
		lines: [{ piece: 'keepsake-box', wood: 'basswood', quantity: 1, initials: 'TR' }],
		shipment: { carrier: 'UPS', trackingNumber: 'DEMO1Z0000000000000002', daysAgo: 15 },
		giftNote: 'Happy birthday, Dad.'
	},
	{
		ref: 'CS-1003',
		buyer: 'Marisol Fenn',
		email: 'marisol@example.test',
		address: {
			line1: '88 Rue des Tilleuls',
			city: 'Sainte-Brigide',
			region: 'QC',
			postcode: 'J0J 1X0',
			country: 'CA'
		},
		status: 'shipped',
		daysAgo: 29,
		lines: [{ piece: 'rosette-ornament', wood: 'basswood', quantity: 3, fromStock: true }],
		shipment: { carrier: 'USPS', trackingNumber: 'DEMOLZ000000003US', daysAgo: 27 }
	},
	{
		ref: 'CS-1004',
		buyer: 'Odette Callow',
		email: 'odette@example.test',
		address: addr('201 Ferry Street', 'Marrow Point', 'ME', '04101'),
		status: 'packed',
		daysAgo: 19,
		lines: [{ piece: 'welcome-plate', wood: 'basswood', quantity: 1, initials: 'EMC' }]
	},
	{
		ref: 'CS-1005',
		buyer: 'Ansel Brightwater',
		email: 'ansel@example.test',
		address: addr('9 Kiln Road', 'Upper Sedge', 'NY', '12401'),
		status: 'finishing',
		daysAgo: 15,
		lines: [{ piece: 'rim-rosette-serving-plate', wood: 'cherry', quantity: 1, initials: 'AB' }]
	},
	{
		ref: 'CS-1006',
		buyer: 'Juniper Vale',
		email: 'juniper@example.test',
		customer: true,
		address: addr('14 Orchard Row', 'Alder Bend', 'VT', '05001'),
		status: 'carving',
		daysAgo: 9,
		lines: [
			{ piece: 'twin-rosette-bottle-holder', wood: 'walnut', quantity: 1, initials: 'JRH' },
			{ piece: 'coffee-scoop', wood: 'cherry', quantity: 1, fromStock: true }
		]
	},
	{
		ref: 'CS-1007',
		buyer: 'Priya Holloway',
		email: 'priya@example.test',
		address: addr('56 Weaver Court', 'Greyling', 'MA', '01002'),
		status: 'carving',
		daysAgo: 7,
		lines: [{ piece: 'keepsake-box', wood: 'cherry', quantity: 1, initials: 'PH' }]
	},
	{
		ref: 'CS-1008',
		buyer: 'Caspar Lindqvist',
		email: 'caspar@example.test',
		address: { line1: 'Storgatan 12', city: 'Norrvik', postcode: '123 45', country: 'SE' },
		status: 'paid',
		daysAgo: 3,
		lines: [{ piece: 'rosette-ornament', wood: 'butternut', quantity: 2, initials: 'CL' }]
	},
	{
		ref: 'CS-1009',
		buyer: 'Hattie Okafor',
		email: 'hattie@example.test',
		address: addr('7 Tannery Walk', 'Linden Ford', 'VT', '05002'),
		status: 'paid',
		daysAgo: 2,
		lines: [{ piece: 'rosette-bottle-holder', wood: 'basswood', quantity: 1, initials: 'HO' }]
	},
	{
		ref: 'CS-1010',
		buyer: 'Ezra Pennick',
		email: 'ezra@example.test',
		address: addr('410 Millrace Ave', 'Copper Falls', 'PA', '15001'),
		status: 'pending',
		daysAgo: 0,
		lines: [{ piece: 'trinket-box', wood: 'walnut', quantity: 1, fromStock: true }]
	},
	{
		ref: 'CS-1011',
		buyer: 'Rosalind Achterberg',
		email: 'rosalind@example.test',
		address: addr('22 Cooper Lane', 'Elm Hollow', 'OH', '43001'),
		status: 'cancelled',
		daysAgo: 12,
		lines: [{ piece: 'welcome-plate', wood: 'butternut', quantity: 1, initials: 'DKA' }]
	},
	{
		ref: 'CS-1012',
		buyer: 'Felix Marchetti',
		email: 'felix@example.test',
		address: addr('5 Beacon Hill', 'Stonebridge', 'CT', '06001'),
		status: 'refunded',
		daysAgo: 21,
		lines: [{ piece: 'rim-rosette-serving-plate', wood: 'maple', quantity: 1, initials: 'FM' }]
	},
	{
		// Paid after the hold lapsed, and the last trinket box had gone to another buyer meanwhile.
		ref: 'CS-1013',
		buyer: 'Wendell Ashcombe',
		email: 'wendell@example.test',
		address: addr('31 Sawmill Road', 'Birch Crossing', 'VT', '05003'),
		status: 'piece_gone',
		daysAgo: 1,
		lines: [{ piece: 'trinket-box', wood: 'walnut', quantity: 1, fromStock: true }]
	}
];

const zoneFor = (country: string) =>
	country === 'US' ? 'domestic' : country === 'CA' || country === 'MX' ? 'north_america' : 'world';

/** Runs the demo seed in one transaction when the database has no pieces; true if it seeded. */
export async function seedDemo(db: SeedDb, now = new Date()): Promise<boolean> {
	const [{ n }] = await db.select({ n: count() }).from(schema.pieces);
	if (n > 0) return false;

	// Hashing is slow on purpose; do it before the transaction holds any locks.
	const hashes = await Promise.all(DEMO_ACCOUNTS.map((a) => hashPassword(a.password)));

	const seeded = await db.transaction(async (tx) => {
		const [{ n: again }] = await tx.select({ n: count() }).from(schema.pieces).for('update');
		if (again > 0) return null;

		const userIds: Record<string, string> = {};
		const existing = await tx
			.select({ id: schema.users.id, email: schema.users.email })
			.from(schema.users);
		for (const [i, a] of DEMO_ACCOUNTS.entries()) {
			const found = existing.find((u) => u.email === a.email);
			if (found) {
				userIds[a.email] = found.id;
				continue;
			}
			const id = crypto.randomUUID();
			await tx.insert(schema.users).values({
				id,
				email: a.email,
				name: a.name,
				passwordHash: hashes[i],
				role: a.role,
				createdAt: daysFromNow(-120, now)
			});
			userIds[a.email] = id;
		}

		const woodIds: Record<string, number> = {};
		for (const w of WOODS) {
			const [{ id }] = await tx
				.insert(schema.woods)
				.values({
					slug: w.slug,
					name: w.name,
					botanicalName: w.botanicalName,
					specificGravityMilli: Math.round(w.specificGravity * 1000),
					densityKgM3: densityAt12(w.specificGravity),
					sideHardnessN: w.sideHardnessN,
					priceAddOnMinor: WOOD_ADD_ON[w.slug] ?? 0,
					toneLight: w.toneLight,
					toneDark: w.toneDark,
					character: w.character,
					caution: w.caution ?? null
				})
				.$returningId();
			woodIds[w.slug] = id;
		}

		const pieceIds: Record<string, number> = {};
		for (const p of DEMO_PIECES) {
			const [{ id }] = await tx
				.insert(schema.pieces)
				.values({
					slug: p.slug,
					title: p.title,
					kind: p.kind,
					summary: p.summary,
					description: p.description,
					lengthMm: p.size[0],
					widthMm: p.size[1],
					thicknessMm: p.size[2],
					basePriceMinor: p.basePriceMinor,
					currency: 'USD',
					personalisable: p.personalisable,
					foodContact: p.foodContact,
					leadDays: p.leadDays,
					pattern: p.pattern,
					active: true,
					createdAt: daysFromNow(-90, now)
				})
				.$returningId();
			pieceIds[p.slug] = id;
			await tx
				.insert(schema.pieceWoods)
				.values(p.woods.map((w) => ({ pieceId: id, woodId: woodIds[w] })));
			const shelf = Object.entries(p.stock);
			if (shelf.length) {
				await tx.insert(schema.stock).values(
					shelf.map(([w, quantity]) => ({
						pieceId: id,
						woodId: woodIds[w],
						place: 'workshop',
						quantity
					}))
				);
			}
		}

		await tx.insert(schema.shippingRates).values(DEMO_SHIPPING_RATES);
		await tx.insert(schema.settings).values([
			{ key: 'salesTax', value: { rateBp: 0 } },
			{ key: 'shopName', value: 'Chipstall' },
			{ key: 'workshop', value: { owner: 'Hollis Marsh', town: 'Linden Ford', country: 'US' } }
		]);

		await seedSettings(tx);
		await seedDemoFairs(tx, now, { pieceIds, woodIds, userIds });
		await seedOrders(tx, now, pieceIds, woodIds, userIds);
		return { pieceIds, woodIds, userIds } satisfies DemoSeedResult;
	});
	if (!seeded) return false;

	for (const extra of demoExtras) {
		try {
			await extra.run(db, seeded);
		} catch (err) {
			console.warn(
				`Demo extra "${extra.name}" failed: ${err instanceof Error ? err.message : String(err)}`
			);
		}
	}
	return true;
}

type Tx = Parameters<Parameters<SeedDb['transaction']>[0]>[0];

function unitPrice(piece: string, wood: string) {
	const p = DEMO_PIECES.find((x) => x.slug === piece)!;
	return p.basePriceMinor + (WOOD_ADD_ON[wood] ?? 0);
}

async function seedOrders(
	tx: Tx,
	now: Date,
	pieceIds: Record<string, number>,
	woodIds: Record<string, number>,
	userIds: Record<string, string>
) {
	for (const o of DEMO_ORDERS) {
		const created = daysFromNow(-o.daysAgo, now);
		const lines = o.lines.map((l) => {
			const piece = DEMO_PIECES.find((p) => p.slug === l.piece)!;
			const wood = WOODS.find((w) => w.slug === l.wood)!;
			const unit = unitPrice(l.piece, l.wood);
			const personalisation: Personalisation | null = l.initials
				? demoSnapshot(piece, l.wood, l.initials)
				: null;
			return {
				pieceId: pieceIds[l.piece],
				woodId: woodIds[l.wood],
				title: piece.title,
				woodName: wood.name,
				quantity: l.quantity,
				unitPriceMinor: unit,
				lineTotalMinor: unit * l.quantity,
				fromStock: l.fromStock ?? false,
				personalisation,
				leadDays: piece.leadDays
			};
		});
		const subtotal = lines.reduce((a, l) => a + l.lineTotalMinor, 0);
		const zone = zoneFor(o.address.country);
		// The demo's parcels all fall in the first two weight bands.
		const band = lines.length > 1 || lines[0].quantity > 1 ? 1 : 0;
		const shipping = DEMO_SHIPPING_RATES.filter((r) => r.zone === zone)[band].priceMinor;
		const total = subtotal + shipping;
		const paid = o.status !== 'pending' && o.status !== 'cancelled';
		const lead = Math.max(...lines.map((l) => l.leadDays));
		const n = o.ref.slice(3);
		const [{ id }] = await tx
			.insert(schema.orders)
			.values({
				ref: o.ref,
				userId: o.customer ? userIds[o.email] : null,
				email: o.email,
				buyerName: o.buyer,
				address: o.address,
				giftNote: o.giftNote ?? null,
				currency: 'USD',
				subtotalMinor: subtotal,
				shippingMinor: shipping,
				taxMinor: 0,
				totalMinor: total,
				status: o.status,
				checkoutSessionId: `cs_demo_${n}`,
				paymentIntentId: paid ? `pi_demo_${n}` : null,
				refundedMinor: o.status === 'refunded' ? total : 0,
				readyBy: paid ? isoDate(daysFromNow(lead - o.daysAgo, now)) : null,
				holdExpiresAt: o.status === 'pending' ? daysFromNow(1 / 48, now) : null,
				createdAt: created,
				paidAt: paid ? new Date(created.getTime() + 120_000) : null
			})
			.$returningId();
		await tx
			.insert(schema.orderLines)
			.values(lines.map(({ leadDays: _lead, ...l }) => ({ orderId: id, ...l })));
		if (o.shipment) {
			await tx.insert(schema.shipments).values({
				orderId: id,
				carrier: o.shipment.carrier,
				trackingNumber: o.shipment.trackingNumber,
				shippedAt: daysFromNow(-o.shipment.daysAgo, now)
			});
		}
	}
}

/** Opens its own connection to `url`, seeds when empty, closes. Used by the scripts and tests. */
export async function seedDemoAt(url: string): Promise<boolean> {
	const conn = await mysql.createConnection({ uri: url, timezone: 'Z' });
	try {
		return await seedDemo(drizzle(conn, { schema, mode: 'default' }));
	} finally {
		await conn.end();
	}
}
