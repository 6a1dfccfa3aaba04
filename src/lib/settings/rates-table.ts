import { z } from 'zod';
import { ZONES, type RateRow, type Zone } from '$lib/catalogue/shipping';
import type { RateLine } from '$lib/settings/settings-schema';
import { formText } from '$lib/forms/parse-form';
import { majorText } from '$lib/locale/money';

/** The zones as the owner reads them. */
export const ZONE_LABELS: Record<Zone, string> = {
	domestic: 'Home country',
	north_america: 'Rest of North America',
	world: 'Rest of the world'
};

/** One row of the rate table as typed: text, so a refused form comes back as it was. */
export type RateInput = { zone: string; upToGrams: string; price: string };

/** Stored bands as table rows, zone by zone, lightest first. */
export function rateInputs(rows: RateRow[]): RateInput[] {
	return [...rows]
		.sort(
			(a, b) =>
				ZONES.indexOf(a.zone as Zone) - ZONES.indexOf(b.zone as Zone) || a.upToGrams - b.upToGrams
		)
		.map((r) => ({
			zone: r.zone,
			upToGrams: String(r.upToGrams),
			price: majorText(r.priceMinor)
		}));
}

/** The posted table: the fields of each row share an index (`zone`, `upToGrams`, `price`). */
export function rateInputsFromForm(form: FormData): RateInput[] {
	const zones = form.getAll('zone');
	const grams = form.getAll('upToGrams');
	const prices = form.getAll('price');
	const n = Math.max(zones.length, grams.length, prices.length);
	return Array.from({ length: Math.min(n, 200) }, (_, i) => ({
		zone: formText(zones[i]),
		upToGrams: formText(grams[i]).trim(),
		price: formText(prices[i]).trim()
	}));
}

type Parsed = { ok: true; rows: RateLine[] } | { ok: false; error: string; row?: number };

/**
 * Rows with neither weight nor price are left out (the spare rows at the bottom). Every zone
 * needs at least one band, and no band may repeat. A message names the row and its zone.
 */
export function parseRateInputs(inputs: RateInput[], schema: z.ZodType<RateLine>): Parsed {
	const rows: RateLine[] = [];
	for (const [i, r] of inputs.entries()) {
		if (!r.upToGrams && !r.price) continue;
		const where = `Row ${i + 1}${r.zone in ZONE_LABELS ? ` (${ZONE_LABELS[r.zone as Zone]})` : ''}`;
		const parsed = schema.safeParse({ zone: r.zone, upToGrams: r.upToGrams, priceMinor: r.price });
		if (!parsed.success)
			return { ok: false, row: i, error: `${where}: ${parsed.error.issues[0].message}` };
		if (rows.some((x) => x.zone === parsed.data.zone && x.upToGrams === parsed.data.upToGrams))
			return { ok: false, row: i, error: `${where}: that zone and weight are already listed.` };
		rows.push(parsed.data);
	}
	const missing = ZONES.filter((z) => !rows.some((r) => r.zone === z));
	if (missing.length)
		return {
			ok: false,
			error: `Add at least one band for ${missing.map((z) => ZONE_LABELS[z]).join(', ')}.`
		};
	return { ok: true, rows };
}

/**
 * The posted rate table as one schema for `parseForm`: the refusal stands under `rates`, its
 * path naming the row (`['rates', row]`) so the page can mark that row.
 */
export function ratesFormSchema(schema: z.ZodType<RateLine>) {
	const row = z.object({ zone: z.string(), upToGrams: z.string(), price: z.string() });
	return z.object({ rates: z.array(row) }).transform((v, ctx) => {
		const parsed = parseRateInputs(v.rates, schema);
		if (parsed.ok) return parsed.rows;
		const path = parsed.row === undefined ? ['rates'] : ['rates', parsed.row];
		ctx.addIssue({ code: 'custom', message: parsed.error, path });
		return z.NEVER;
	});
}
