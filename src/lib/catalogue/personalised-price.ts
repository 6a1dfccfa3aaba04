/**
 * Small pure helpers the personaliser shows beside the preview. The server prices the cart on
 * its own (src/lib/server/pricing.ts); these only say what the buyer will see there.
 */
import { hardnessWords, type WoodFacts } from './woods';
import { addDays } from '../locale/dates';

/** Base price plus the chosen wood's add-on, in integer minor units. */
export function personalisedPriceMinor(basePriceMinor: number, woodAddOnMinor = 0): number {
	if (!Number.isSafeInteger(basePriceMinor) || !Number.isSafeInteger(woodAddOnMinor)) {
		throw new Error('Prices are whole minor units');
	}
	return basePriceMinor + woodAddOnMinor;
}

/** The shop's day ('YYYY-MM-DD', see $lib/locale/dates) a piece ordered at `from` is ready. */
export function readyBy(leadDays: number, from: Date = new Date()): string {
	return addDays(from, leadDays);
}

export type WoodChoice = {
	slug: string;
	name: string;
	toneLight: string;
	toneDark: string;
	/** Plain words on hardness, e.g. "soft". */
	hardness: string;
	/** One line on colour and character. */
	character: string;
	priceAddOnMinor?: number;
	caution?: string;
};

/** The swatch data for the personaliser from the woods list (and optional add-ons by slug). */
export function woodChoices(woods: WoodFacts[], addOns: Record<string, number> = {}): WoodChoice[] {
	return woods.map((w) => ({
		slug: w.slug,
		name: w.name,
		toneLight: w.toneLight,
		toneDark: w.toneDark,
		hardness: hardnessWords(w.sideHardnessN),
		character: w.character,
		priceAddOnMinor: addOns[w.slug] ?? 0,
		caution: w.caution
	}));
}
