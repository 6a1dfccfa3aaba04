import { error } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import { workshopOrderDetail } from '$lib/server/orders/views';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'owner', 'helper');
	const order = await workshopOrderDetail(event.params.ref);
	if (!order) error(404, `There is no order ${event.params.ref}.`);
	return { order };
};
