import { error } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/auth/guard';
import { isFailure, orFail, runForm } from '$lib/server/errors/form-answer';
import { workshopOrderDetail } from '$lib/server/orders/views';
import { canCancel, nextStatuses, stepBackTo } from '$lib/orders/status';
import { moveSchema, noteSchema, steerSchema } from '$lib/orders/actions-schema';
import { shipmentSchema } from '$lib/orders/shipment-schema';
import { refundFormSchema } from '$lib/orders/refund-schema';
import { balanceSchema } from '$lib/orders/balance-schema';
import * as steps from '$lib/server/orders/workshop-steps';
import { orderIdOf, orderWorkbench } from '$lib/server/orders/workbench';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'owner', 'helper');
	const order = await workshopOrderDetail(event.params.ref);
	if (!order) error(404, `There is no order ${event.params.ref}.`);
	const needsCarving = order.lines.some((l) => !l.fromStock);
	return {
		order,
		role: user.role,
		next: nextStatuses(order.status, { needsCarving }),
		back: stepBackTo(order.status, { needsCarving }),
		cancellable: canCancel(order.status),
		...(await orderWorkbench(await orderIdOf(order.ref)))
	};
};

/**
 * One form of the page: who may use it, its schema, and the domain step, which answers with the
 * sentence shown once done. Every answer names its form, so the page shows it beside that form.
 */
async function step<S extends z.ZodType>(
	event: RequestEvent,
	form: string,
	who: ('owner' | 'helper')[],
	schema: S,
	run: (data: z.output<S>, by: { userId: string }, ref: string) => Promise<string>
) {
	const by = { userId: requireRole(event, ...who).id };
	const answer = async (d: z.output<S>) => ({ form, done: await run(d, by, event.params.ref) });
	return runForm(event.request, schema, answer, { form });
}

const staff: ('owner' | 'helper')[] = ['owner', 'helper'];
const none = z.object({});

export const actions: Actions = {
	move: (e) => step(e, 'move', staff, moveSchema, (m, by, ref) => steps.benchMove(ref, m, by)),
	ship: (e) =>
		step(e, 'ship', staff, shipmentSchema, (s, by, ref) =>
			steps.shipStep(ref, s, by, e.url.origin)
		),
	/** The amount is typed in the order's currency, so the schema needs the order first. */
	refund: async (e) => {
		requireRole(e, 'owner');
		const currency = await orFail(() => steps.orderCurrency(e.params.ref), { form: 'refund' });
		if (isFailure(currency)) return currency;
		return step(e, 'refund', ['owner'], refundFormSchema(currency), (r, by, ref) =>
			steps.refundStep(ref, r, by, e.url.origin)
		);
	},
	returned: (e) => step(e, 'returned', ['owner'], none, (_, __, ref) => steps.returnedStep(ref)),
	balance: (e) =>
		step(e, 'balance', ['owner'], balanceSchema, (b, by, ref) =>
			steps.balanceStep(ref, b.method, by)
		),
	cancel: (e) =>
		step(e, 'cancel', ['owner'], steerSchema, (s, by, ref) =>
			steps.cancelStep(ref, s, by, e.url.origin)
		),
	back: (e) => step(e, 'back', ['owner'], steerSchema, (s, by, ref) => steps.backStep(ref, s, by)),
	note: (e) => step(e, 'note', staff, noteSchema, (n, by, ref) => steps.noteStep(ref, n.body, by))
};
