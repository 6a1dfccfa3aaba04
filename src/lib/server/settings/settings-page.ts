/**
 * The settings page's data and its one way of saving a section: parse the section's form, save
 * it, answer `{ saved: section }`; a refusal comes back beside that section with what was typed.
 */
import type { z } from 'zod';
import { formFail, parseForm } from '$lib/forms/parse-form';
import { formatClock, timeZoneNames } from '$lib/locale/dates';
import { MINOR_DIGITS } from '$lib/locale/money';
import { LOCALES, rateLine } from '$lib/settings/settings-schema';
import {
	rateInputs,
	rateInputsFromForm,
	ratesFormSchema,
	type RateInput
} from '$lib/settings/rates-table';
import { readShippingRates, replaceShippingRates } from '../catalogue/shipping-rates';
import { getSalesTax } from './sales-tax';
import { getAway, getPolicies, getShopFormat, getShopInfo, getShopWords } from './shop-settings';

/** Everything the settings page shows, the shipping rates as the table's rows. */
export async function settingsPage() {
	const [salesTax, shop, away, policies, rates, format, words] = await Promise.all([
		getSalesTax(),
		getShopInfo(),
		getAway(),
		getPolicies(),
		readShippingRates(),
		getShopFormat(),
		getShopWords()
	]);
	const now = new Date();
	return {
		salesTax,
		shop,
		away,
		policies,
		rates: rateInputs(rates),
		format,
		words,
		// Each zone with the time it is there now, so the owner can tell theirs at a glance.
		zones: timeZoneNames().map((name) => ({ name, now: formatClock(now, name) })),
		locales: [...LOCALES],
		currencies: Object.keys(MINOR_DIGITS)
	};
}

/** Saves one section of the settings page. */
export async function saveSection<S extends z.ZodType>(
	request: Request,
	section: string,
	schema: S,
	save: (data: z.output<S>) => Promise<unknown>,
	input?: (texts: Record<string, string>) => unknown
) {
	const parsed = await parseForm(request, schema, {
		extra: { section },
		...(input ? { input } : {})
	});
	if (!parsed.ok) return parsed.failure;
	await save(parsed.data);
	return { saved: section };
}

/** Saves the shipping rates table; a refused row comes back named, with the table as typed. */
export async function saveRates(request: Request) {
	const parsed = await parseForm(request, ratesFormSchema(rateLine), {
		input: (_, form) => ({ rates: rateInputsFromForm(form) })
	});
	if (!parsed.ok) {
		const row = parsed.issues[0].path[1];
		return formFail(400, parsed.issues[0].message, {
			section: 'rates',
			errors: parsed.errors,
			rateRow: typeof row === 'number' ? row : null,
			rates: (parsed.input as { rates: RateInput[] }).rates
		});
	}
	await replaceShippingRates(parsed.data);
	return { saved: 'rates' };
}
