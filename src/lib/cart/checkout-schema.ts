import { z } from 'zod';
import { emailAddress } from '../forms/email';
import { COUNTRIES } from '$lib/locale/countries';
import { plain } from '../forms/plain-text';
import { checkRegion } from '$lib/locale/regions';

const text = (label: string, max: number) =>
	plain(
		z
			.string({ error: `Enter ${label}.` })
			.trim()
			.min(1, `Enter ${label}.`)
			.max(max, `Keep ${label} under ${max} characters.`)
	);

/** Postcode shapes for the countries whose formats we know; others get a loose check. */
const POSTCODE: Record<string, [RegExp, string]> = {
	US: [/^\d{5}(-\d{4})?$/, 'A US ZIP code is five digits, like 80302 or 80302-1234.'],
	CA: [/^[A-Z]\d[A-Z] ?\d[A-Z]\d$/, 'A Canadian postal code looks like K1A 0B1.'],
	GB: [/^[A-Z]{1,2}\d[A-Z\d]? ?\d[A-Z]{2}$/, 'A UK postcode looks like SW1A 1AA.'],
	DE: [/^\d{5}$/, 'A German postcode is five digits.'],
	FR: [/^\d{5}$/, 'A French postcode is five digits.'],
	AU: [/^\d{4}$/, 'An Australian postcode is four digits.'],
	JP: [/^\d{3}-?\d{4}$/, 'A Japanese postcode looks like 100-0001.']
};

export const checkoutSchema = z
	.object({
		name: text('your name', 120),
		email: emailAddress,
		line1: text('the street address', 120),
		line2: plain(z.string().trim().max(120, 'Keep this line under 120 characters.')).optional(),
		city: text('the town or city', 80),
		region: plain(
			z.string().trim().max(80, 'Keep the state or region under 80 characters.')
		).optional(),
		postcode: z.string().trim().toUpperCase().max(12, 'That postcode is too long.'),
		country: z.enum(COUNTRIES, { error: 'Choose a country we post to.' }),
		giftNote: plain(
			z.string().trim().max(500, 'Keep the gift note under 500 characters.'),
			true
		).optional(),
		/** What the buyer was shown; used only to tell them when the price has changed. */
		seenTotal: z.coerce.number().int().nonnegative().optional().catch(undefined)
	})
	.superRefine((v, ctx) => {
		const rule = POSTCODE[v.country];
		if (!v.postcode) {
			ctx.addIssue({ code: 'custom', path: ['postcode'], message: 'Enter the postcode.' });
		} else if (rule && !rule[0].test(v.postcode)) {
			ctx.addIssue({ code: 'custom', path: ['postcode'], message: rule[1] });
		} else if (!rule && !/^[A-Z0-9][A-Z0-9 -]{1,10}$/.test(v.postcode)) {
			ctx.addIssue({
				code: 'custom',
				path: ['postcode'],
				message: 'Use letters, digits and spaces only.'
			});
		}
		// A region by name or code ("Vermont" or "VT"): checked here, kept as the address writes it.
		const region = checkRegion(v.country, v.region);
		if (!region.ok) ctx.addIssue({ code: 'custom', path: ['region'], message: region.message });
	})
	.transform((v) => {
		const region = checkRegion(v.country, v.region);
		return { ...v, region: region.ok ? region.region : v.region };
	});

export type CheckoutInput = z.infer<typeof checkoutSchema>;
