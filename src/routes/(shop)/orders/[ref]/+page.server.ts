import { error } from '@sveltejs/kit';
import { buyerOrderView, orderByRef } from '$lib/server/orders/views';
import { verifyOrderKey } from '$lib/server/orders/links';
import type { PageServerLoad } from './$types';

/** Reachable by the signed link from the e-mail, or by the signed-in account that placed it. */
export const load: PageServerLoad = async ({ params, url, locals }) => {
	const ref = params.ref.toUpperCase();
	const order = /^[A-Z]{2}-[A-Z0-9]{3,12}$/.test(ref) ? await orderByRef(ref) : null;
	const byLink = order && verifyOrderKey(order.ref, url.searchParams.get('k'));
	const byAccount = order && locals.user && order.userId === locals.user.id;
	// Same answer for "no such order" and "not yours", so references cannot be probed.
	if (!order || (!byLink && !byAccount) || order.status === 'pending') {
		error(404, 'We cannot show that order. Open the link in your confirmation e-mail, or sign in.');
	}
	return { order: await buyerOrderView(order) };
};
