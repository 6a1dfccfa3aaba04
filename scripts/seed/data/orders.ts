/**
 * The demo's orders, one or more in every state, as plain data: who bought what, where it goes
 * and how long ago. Prices, tax, shipping and snapshots are computed by the seed through the
 * shop's own functions (scripts/seed/orders.ts), never written here.
 */
import type { Address, OrderStatus } from '../../../src/lib/server/db/schema';

export type DemoOrder = {
	ref: string;
	buyer: string;
	email: string;
	customer?: boolean;
	address: Address;
	status: OrderStatus;
	daysAgo: number;
	lines: {
		piece: string;
		wood: string;
		quantity: number;
		initials?: string;
		/** Rosette style; the piece's own (classic or split) when missing. */
		style?: string;
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
		lines: [{ piece: 'rosette-ornament', wood: 'basswood', quantity: 3 }],
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
		// Two letters on a 36 mm rosette need the open centre to carve cleanly in cherry.
		lines: [
			{
				piece: 'rim-rosette-serving-plate',
				wood: 'cherry',
				quantity: 1,
				initials: 'AB',
				style: 'open'
			}
		]
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
			{ piece: 'coffee-scoop', wood: 'cherry', quantity: 1 }
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
		lines: [{ piece: 'trinket-box', wood: 'walnut', quantity: 1 }]
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
		lines: [{ piece: 'trinket-box', wood: 'walnut', quantity: 1 }]
	}
];
