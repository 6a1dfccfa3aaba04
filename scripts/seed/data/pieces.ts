/** Hollis Marsh's eight pieces and the shop's shipping rates, as plain data. */
import type { PieceKind } from '../../../src/lib/catalogue/kinds';
import type { PiecePattern } from '../../../src/lib/pattern/snapshot';

export type DemoPiece = {
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
