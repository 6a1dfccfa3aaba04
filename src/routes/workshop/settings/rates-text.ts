import { majorText } from '$lib/money';
import type { z } from 'zod';
import { ZONES } from '$lib/shipping';
import type { RateLine } from '$lib/schemas/settings';
import type { RateRow } from '$lib/shipping';

/**
 * The rate table as plain lines the owner can edit, "zone up-to-grams price":
 * `domestic 500 8.95`. Easier to scan and change than a grid of inputs.
 */
export function formatRates(rows: RateRow[]) {
	return rows.map((r) => `${r.zone} ${r.upToGrams} ${majorText(r.priceMinor)}`).join('\n');
}

type Parsed = { ok: true; rows: RateLine[] } | { ok: false; error: string };

/** Every zone needs at least one band, and no band may repeat. Messages name the line. */
export function parseRates(raw: string, schema: z.ZodType<RateLine>): Parsed {
	const rows: RateLine[] = [];
	const lines = raw.split(/\r?\n/).map((l) => l.trim());
	for (const [i, l] of lines.entries()) {
		if (!l) continue;
		const [zone, upToGrams, price, ...rest] = l.split(/\s+/);
		if (rest.length)
			return { ok: false, error: `Line ${i + 1}: three parts, e.g. "domestic 500 8.95".` };
		const parsed = schema.safeParse({ zone, upToGrams, priceMinor: price ?? '' });
		if (!parsed.success)
			return { ok: false, error: `Line ${i + 1}: ${parsed.error.issues[0].message}` };
		if (rows.some((r) => r.zone === parsed.data.zone && r.upToGrams === parsed.data.upToGrams))
			return { ok: false, error: `Line ${i + 1}: that zone and weight are already listed.` };
		rows.push(parsed.data);
	}
	const missing = ZONES.filter((z) => !rows.some((r) => r.zone === z));
	if (missing.length)
		return { ok: false, error: `Add at least one band for ${missing.join(', ')}.` };
	return { ok: true, rows };
}
