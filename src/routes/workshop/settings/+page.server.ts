import { requireRole } from '$lib/server/auth/guard';
import { setSalesTax } from '$lib/server/settings/sales-tax';
import {
	setAway,
	setPolicies,
	setShopFormat,
	setShopInfo,
	setShopWords
} from '$lib/server/settings/shop-settings';
import { saveRates, saveSection, settingsPage } from '$lib/server/settings/settings-page';
import {
	away,
	policies,
	salesTaxForm,
	shopFormat,
	shopInfo,
	shopWords
} from '$lib/settings/settings-schema';
import type { Actions, PageServerLoad } from './$types';

const ADDRESS_KEYS = ['name', 'line1', 'line2', 'city', 'region', 'postcode', 'country'];

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'owner');
	return settingsPage();
};

export const actions: Actions = {
	tax: (event) => {
		requireRole(event, 'owner');
		return saveSection(event.request, 'tax', salesTaxForm, (t) =>
			setSalesTax({ rateBp: t.rate, basis: t.basis })
		);
	},
	shop: (event) => {
		requireRole(event, 'owner');
		// The address fields are posted as address.<key>; the schema wants them nested.
		return saveSection(event.request, 'shop', shopInfo, setShopInfo, (t) => ({
			name: t.name ?? '',
			email: t.email ?? '',
			address: Object.fromEntries(ADDRESS_KEYS.map((k) => [k, t[`address.${k}`] ?? '']))
		}));
	},
	away: (event) => {
		requireRole(event, 'owner');
		return saveSection(event.request, 'away', away, setAway);
	},
	format: (event) => {
		requireRole(event, 'owner');
		return saveSection(event.request, 'format', shopFormat, setShopFormat);
	},
	words: (event) => {
		requireRole(event, 'owner');
		return saveSection(event.request, 'words', shopWords, setShopWords);
	},
	policies: (event) => {
		requireRole(event, 'owner');
		return saveSection(event.request, 'policies', policies, setPolicies);
	},
	rates: (event) => {
		requireRole(event, 'owner');
		return saveRates(event.request);
	}
};
