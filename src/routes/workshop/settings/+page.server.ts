import { fail } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import { getSalesTax, setSalesTax } from '$lib/server/settings/sales-tax';
import {
	getAway,
	getPolicies,
	getShopFormat,
	getShopInfo,
	getShopWords,
	setAway,
	setPolicies,
	setShopFormat,
	setShopInfo,
	setShopWords
} from '$lib/server/settings/shop-settings';
import { formatClock, timeZoneNames } from '$lib/locale/dates';
import { MINOR_DIGITS } from '$lib/locale/money';
import { readShippingRates, replaceShippingRates } from '$lib/server/catalogue/shipping-rates';
import {
	away,
	LOCALES,
	policies,
	rateLine,
	salesTaxForm,
	shopFormat,
	shopInfo,
	shopWords
} from '$lib/settings/settings-schema';
import { parseRateInputs, rateInputs, rateInputsFromForm } from './rates-table';
import type { Actions, PageServerLoad } from './$types';
import { parseForm } from '$lib/forms/parse-form';

const ADDRESS_KEYS = ['name', 'line1', 'line2', 'city', 'region', 'postcode', 'country'];

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'owner');
	const [salesTax, shop, awayNow, policy, rates, format, words] = await Promise.all([
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
		away: awayNow,
		policies: policy,
		rates: rateInputs(rates),
		format,
		words,
		// Each zone with the time it is there now, so the owner can tell theirs at a glance.
		zones: timeZoneNames().map((name) => ({ name, now: formatClock(now, name) })),
		locales: [...LOCALES],
		currencies: Object.keys(MINOR_DIGITS)
	};
};

export const actions: Actions = {
	tax: async (event) => {
		requireRole(event, 'owner');
		const parsed = await parseForm(event.request, salesTaxForm, { extra: { section: 'tax' } });
		if (!parsed.ok) return parsed.failure;
		await setSalesTax({ rateBp: parsed.data.rate, basis: parsed.data.basis });
		return { saved: 'tax' };
	},
	shop: async (event) => {
		requireRole(event, 'owner');
		// The address fields are posted as address.<key>; the schema wants them nested.
		const parsed = await parseForm(event.request, shopInfo, {
			extra: { section: 'shop' },
			input: (t) => ({
				name: t.name ?? '',
				email: t.email ?? '',
				address: Object.fromEntries(ADDRESS_KEYS.map((k) => [k, t[`address.${k}`] ?? '']))
			})
		});
		if (!parsed.ok) return parsed.failure;
		await setShopInfo(parsed.data);
		return { saved: 'shop' };
	},
	away: async (event) => {
		requireRole(event, 'owner');
		const parsed = await parseForm(event.request, away, { extra: { section: 'away' } });
		if (!parsed.ok) return parsed.failure;
		await setAway(parsed.data);
		return { saved: 'away' };
	},
	format: async (event) => {
		requireRole(event, 'owner');
		const parsed = await parseForm(event.request, shopFormat, { extra: { section: 'format' } });
		if (!parsed.ok) return parsed.failure;
		await setShopFormat(parsed.data);
		return { saved: 'format' };
	},
	words: async (event) => {
		requireRole(event, 'owner');
		const parsed = await parseForm(event.request, shopWords, { extra: { section: 'words' } });
		if (!parsed.ok) return parsed.failure;
		await setShopWords(parsed.data);
		return { saved: 'words' };
	},
	policies: async (event) => {
		requireRole(event, 'owner');
		const parsed = await parseForm(event.request, policies, { extra: { section: 'policies' } });
		if (!parsed.ok) return parsed.failure;
		await setPolicies(parsed.data);
		return { saved: 'policies' };
	},
	rates: async (event) => {
		requireRole(event, 'owner');
		const typed = rateInputsFromForm(await event.request.formData());
		const parsed = parseRateInputs(typed, rateLine);
		if (!parsed.ok)
			return fail(400, {
				section: 'rates',
				errors: { rates: [parsed.error] },
				rateRow: parsed.row ?? null,
				rates: typed
			});
		await replaceShippingRates(parsed.rows);
		return { saved: 'rates' };
	}
};
