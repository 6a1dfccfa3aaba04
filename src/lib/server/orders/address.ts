import type { Address } from '../db/schema';
import type { CheckoutInput } from '$lib/cart/checkout-schema';
import { checkRegion } from '$lib/locale/regions';

/**
 * The address an order keeps. The region is stored as $lib/locale/regions gives it (the code for US, CA
 * and AU, the list's own spelling elsewhere, else as typed), never uppercased: "Tôkyô" and
 * "Łódzkie" are names, not codes, and a label printed in capitals of them reads wrong.
 */
export function addressOf(buyer: CheckoutInput): Address {
	const checked = checkRegion(buyer.country, buyer.region);
	const region = checked.ok ? checked.region : buyer.region?.trim() || undefined;
	return {
		line1: buyer.line1,
		...(buyer.line2 ? { line2: buyer.line2 } : {}),
		city: buyer.city,
		...(region ? { region } : {}),
		postcode: buyer.postcode,
		country: buyer.country
	};
}
