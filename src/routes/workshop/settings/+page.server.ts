import { z } from 'zod';
import { requireRole } from '$lib/server/auth/guard';
import { getSalesTaxBp, setSalesTaxBp } from '$lib/server/settings/sales-tax';
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
import { MINOR_DIGITS, parsePercent } from '$lib/locale/money';
import { readShippingRates, replaceShippingRates } from '$lib/server/catalogue/shipping-rates';
import {
	away,
	LOCALES,
	policies,
	rateLine,
	shopFormat,
	shopInfo,
	shopWords
} from '$lib/settings/settings-schema';
import { rateInputs, rateInputsFromForm, ratesFormSchema, type RateInput } from './rates-table';
import { recomputeReadyBy } from '$lib/server/queue/carving-queue';
import type { Actions, PageServerLoad } from './$types';
import { formFail, parseForm } from '$lib/forms/parse-form';

/** The rate as typed, in percent with up to two decimals (7.25 → 725 basis points). */
const taxSchema = z.object({
	rate: z
		.string()
		.trim()
		.regex(/^\d{1,2}([.,]\d{1,2})?$/, 'Type a percentage like 7.25, or 0 for none.')
		.transform((s) => parsePercent(s) ?? -1)
		.pipe(
			z.number().int().min(0).max(2500, 'That is higher than any sales tax we know of; check it.')
		)
});

const ADDRESS_KEYS = ['name', 'line1', 'line2', 'city', 'region', 'postcode', 'country'];

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'owner');
	const [rateBp, shop, awayNow, policy, rates, format, words] = await Promise.all([
		getSalesTaxBp(),
		getShopInfo(),
		getAway(),
		getPolicies(),
		readShippingRates(),
		getShopFormat(),
		getShopWords()
	]);
	const now = new Date();
	return {
		rateBp,
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
		const parsed = await parseForm(event.request, taxSchema);
		if (!parsed.ok) return parsed.failure;
		await setSalesTaxBp(parsed.data.rate);
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
		// Away days are days off for the carving queue: every queued order's date moves.
		await recomputeReadyBy();
		return { saved: 'away' };
	},
	format: async (event) => {
		requireRole(event, 'owner');
		const parsed = await parseForm(event.request, shopFormat, { extra: { section: 'format' } });
		if (!parsed.ok) return parsed.failure;
		await setShopFormat(parsed.data);
		// "Today" may now be another day: every queued order's date is worked out again.
		await recomputeReadyBy();
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
		const parsed = await parseForm(event.request, ratesFormSchema(rateLine), {
			input: (_, form) => ({ rates: rateInputsFromForm(form) })
		});
		if (!parsed.ok) {
			const [issue] = parsed.issues;
			const row = issue.path[1];
			return formFail(400, issue.message, {
				section: 'rates',
				errors: parsed.errors,
				rateRow: typeof row === 'number' ? row : null,
				rates: (parsed.input as { rates: RateInput[] }).rates
			});
		}
		await replaceShippingRates(parsed.data);
		return { saved: 'rates' };
	}
};
