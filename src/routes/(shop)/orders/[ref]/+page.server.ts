import { error } from '@sveltejs/kit';
import { buyerOrderView, orderByRef } from '$lib/server/orders/views';
import { verifyOrderKey } from '$lib/server/orders/links';
import { messageShop } from '$lib/server/orders/buyer-message';
import { tryAgainIn } from '$lib/server/http/rate-limit';
import { formFail, parseForm } from '$lib/forms/parse-form';
import { orderMessageSchema } from '$lib/orders/message-schema';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

/** Reachable by the signed link from the e-mail, or by the signed-in account that placed it. */
async function theirOrder({
	params,
	url,
	locals
}: Pick<RequestEvent, 'params' | 'url' | 'locals'>) {
	const ref = params.ref.toUpperCase();
	const order = /^[A-Z]{2}-[A-Z0-9]{3,12}$/.test(ref) ? await orderByRef(ref) : null;
	const byLink = order && verifyOrderKey(order.ref, url.searchParams.get('k'));
	const byAccount = order && locals.user && order.userId === locals.user.id;
	// Same answer for "no such order" and "not yours", so references cannot be probed.
	if (!order || (!byLink && !byAccount) || order.status === 'pending') {
		error(404, 'We cannot show that order. Open the link in your confirmation e-mail, or sign in.');
	}
	return order;
}

export const load: PageServerLoad = async (event) => {
	return { order: await buyerOrderView(await theirOrder(event)) };
};

export const actions: Actions = {
	/** The buyer writes to the shop about this order (an e-mail to the owner, throttled). */
	message: async (event) => {
		const order = await theirOrder(event);
		const parsed = await parseForm(event.request, orderMessageSchema);
		if (!parsed.ok) return parsed.failure;
		const sent = await messageShop(
			order,
			parsed.data.body,
			event.getClientAddress(),
			event.url.origin
		);
		if (!sent.ok) {
			const wait = tryAgainIn(sent.retryAfterS);
			return formFail(429, wait, { errors: { body: [wait] }, values: parsed.values });
		}
		return { sent: true };
	}
};
