import { fail } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/auth/guard';
import { getSalesTaxBp, setSalesTaxBp } from '$lib/server/settings';
import {
	getAway,
	getPolicies,
	getShopInfo,
	setAway,
	setPolicies,
	setShopInfo
} from '$lib/server/shop-settings';
import { readShippingRates, replaceShippingRates } from '$lib/server/catalogue/shipping-rates';
import { away, policies, rateLine, shopInfo } from '$lib/schemas/settings';
import { formatRates, parseRates } from './rates-text';
import { recomputeReadyBy } from '$lib/server/orders/carving-queue';
import type { Actions, PageServerLoad } from './$types';
import { formText } from '$lib/form-text';

/** The rate as typed, in percent with up to two decimals (7.25 → 725 basis points). */
const taxSchema = z.object({
	rate: z
		.string()
		.trim()
		.regex(/^\d{1,2}(\.\d{1,2})?$/, 'Type a percentage like 7.25, or 0 for none.')
		.transform((s) => Math.round(Number(s) * 100))
		.pipe(
			z.number().int().min(0).max(2500, 'That is higher than any sales tax we know of; check it.')
		)
});

/** zod issues as `{ field: [message] }`, nested paths joined with dots (address.city). */
function fieldErrors(issues: z.core.$ZodIssue[]) {
	const out: Record<string, string[]> = {};
	for (const i of issues) (out[i.path.join('.')] ??= []).push(i.message);
	return out;
}

const text = (form: FormData, k: string) => formText(form.get(k) ?? undefined);

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'owner');
	const [rateBp, shop, awayNow, policy, rates] = await Promise.all([
		getSalesTaxBp(),
		getShopInfo(),
		getAway(),
		getPolicies(),
		readShippingRates()
	]);
	return { rateBp, shop, away: awayNow, policies: policy, ratesText: formatRates(rates) };
};

export const actions: Actions = {
	tax: async (event) => {
		requireRole(event, 'owner');
		const form = Object.fromEntries(await event.request.formData());
		const parsed = taxSchema.safeParse(form);
		if (!parsed.success) {
			return fail(400, {
				errors: { rate: [parsed.error.issues[0].message] },
				values: { rate: formText(form.rate) }
			});
		}
		await setSalesTaxBp(parsed.data.rate);
		return { saved: 'tax' };
	},
	shop: async (event) => {
		requireRole(event, 'owner');
		const f = await event.request.formData();
		const input = {
			name: text(f, 'name'),
			email: text(f, 'email'),
			address: Object.fromEntries(
				['name', 'line1', 'line2', 'city', 'region', 'postcode', 'country'].map((k) => [
					k,
					text(f, `address.${k}`)
				])
			)
		};
		const parsed = shopInfo.safeParse(input);
		if (!parsed.success)
			return fail(400, { section: 'shop', errors: fieldErrors(parsed.error.issues) });
		await setShopInfo(parsed.data);
		return { saved: 'shop' };
	},
	away: async (event) => {
		requireRole(event, 'owner');
		const f = await event.request.formData();
		const parsed = away.safeParse({ until: text(f, 'until'), note: text(f, 'note') });
		if (!parsed.success)
			return fail(400, { section: 'away', errors: fieldErrors(parsed.error.issues) });
		await setAway(parsed.data);
		// Away days are days off for the carving queue: every queued order's date moves.
		await recomputeReadyBy();
		return { saved: 'away' };
	},
	policies: async (event) => {
		requireRole(event, 'owner');
		const f = await event.request.formData();
		const parsed = policies.safeParse({
			returnsDays: text(f, 'returnsDays'),
			extra: text(f, 'extra')
		});
		if (!parsed.success)
			return fail(400, { section: 'policies', errors: fieldErrors(parsed.error.issues) });
		await setPolicies(parsed.data);
		return { saved: 'policies' };
	},
	rates: async (event) => {
		requireRole(event, 'owner');
		const raw = text(await event.request.formData(), 'rates');
		const parsed = parseRates(raw, rateLine);
		if (!parsed.ok) return fail(400, { section: 'rates', errors: { rates: [parsed.error] }, raw });
		await replaceShippingRates(parsed.rows);
		return { saved: 'rates' };
	}
};
