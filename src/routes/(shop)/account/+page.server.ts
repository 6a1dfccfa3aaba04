import { redirect } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals }) => {
	if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent('/account')}`);
	const { name, email, role } = locals.user;
	// The shop work replaces this with the signed-in buyer's past orders.
	const orders: { ref: string; createdAt: Date; status: string; totalMinor: number; currency: string }[] = [];
	return { account: { name, email, role }, orders };
};
