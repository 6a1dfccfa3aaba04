import { redirect } from '@sveltejs/kit';
import { ordersForUser } from '$lib/server/orders/views';
import { isEmailConfirmed } from '$lib/server/auth/guest-orders';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals }) => {
	if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent('/account')}`);
	const { name, email, role } = locals.user;
	const [orders, emailConfirmed] = await Promise.all([
		ordersForUser(locals.user.id),
		isEmailConfirmed(locals.user.id)
	]);
	return { account: { name, email, role, emailConfirmed }, orders };
};
