import { z } from 'zod';
import { requireRole } from '$lib/server/auth/guard';
import { moveOrders } from '$lib/server/orders/bulk';
import { orderStatuses } from '$lib/orders/status';
import { isBenchMove } from '$lib/queue/workbench-moves';
import { formFail, parseForm } from '$lib/forms/parse-form';
import type { Actions, PageServerLoad } from './$types';

/** The table itself is fetched by the browser from /api/workshop/orders; this checks the role. */
export const load: PageServerLoad = (event) => {
	const user = requireRole(event, 'owner', 'helper');
	return { role: user.role };
};

const moveSchema = z.object({
	refs: z.array(z.string().trim().min(1).max(16)).min(1, 'Select at least one order.').max(100),
	to: z.enum(orderStatuses, { error: 'Choose where to move them.' })
});

export const actions: Actions = {
	/** Moves the selected orders on together; each one goes only where its status allows. */
	move: async (event) => {
		const user = requireRole(event, 'owner', 'helper');
		const parsed = await parseForm(event.request, moveSchema, {
			input: (t, form) => ({ refs: form.getAll('refs'), to: t.to })
		});
		if (!parsed.ok) return parsed.failure;
		if (!isBenchMove(parsed.data.to)) {
			return formFail(400, 'Orders move on together only to carving, finishing or packed.');
		}
		return { moved: await moveOrders(parsed.data.refs, parsed.data.to, user.id) };
	}
};
