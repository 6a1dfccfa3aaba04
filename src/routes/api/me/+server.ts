import { json } from '@sveltejs/kit';
import { cartCount, cartIdFrom } from '$lib/server/cart';
import type { RequestHandler } from './$types';

/**
 * What the shop's header shows for this visitor (basket count, signed-in name), asked by the
 * browser after the page has loaded, so the public pages themselves are the same for everyone and
 * the page cache can serve them to shoppers with a basket too. Never stored by anyone.
 */
export const GET: RequestHandler = async ({ cookies, locals }) => {
	const basketCount = await cartCount(cartIdFrom(cookies));
	const user = locals.user;
	return json(
		{
			basketCount,
			name: user?.name ?? null,
			staff: user ? user.role !== 'customer' : false
		},
		{ headers: { 'cache-control': 'private, no-store' } }
	);
};
