import { error, fail } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import { firstError, parseForm } from '$lib/forms/parse-form';
import { workshopOrderDetail } from '$lib/server/orders/views';
import { canCancel, nextStatuses, statusLabel, stepBackTo } from '$lib/orders/status';
import { formatMoney } from '$lib/locale/money';
import { isBenchMove } from '$lib/queue/workbench-moves';
import { moveSchema, noteSchema, steerSchema } from '$lib/orders/actions-schema';
import { shipmentSchema } from '$lib/orders/shipment-schema';
import { refundFormSchema } from '$lib/orders/refund-schema';
import { balanceSchema } from '$lib/orders/balance-schema';
import { recordBalancePaid } from '$lib/server/orders/balance';
import { moveOrder, StatusMoveError } from '$lib/server/orders/status';
import { OrderNotFoundError, shipOrder } from '$lib/server/orders/ship';
import { markPiecesReturned, refundOrder, RefundError } from '$lib/server/orders/refunds';
import { cancelOrder, stepBackOrder } from '$lib/server/orders/steer';
import { addOrderNote, orderIdOf, orderWorkbench } from '$lib/server/queue/workbench';
import type { Actions, PageServerLoad } from './$types';

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

/** Domain refusals become a form message; anything else is a real fault. */
function refused(err: unknown, form: string) {
	if (err instanceof StatusMoveError || err instanceof RefundError)
		return fail(err.status, { form, error: err.message });
	if (err instanceof OrderNotFoundError) return fail(404, { form, error: err.message });
	throw err;
}

export const actions: Actions = {
	move: async (event) => {
		const user = requireRole(event, 'owner', 'helper');
		const parsed = await parseForm(event.request, moveSchema);
		if (!parsed.ok) return fail(400, { form: 'move', error: firstError(parsed.errors) });
		const { to, why, expect } = parsed.data;
		if (!isBenchMove(to)) {
			return fail(400, {
				form: 'move',
				error: 'That change has its own way: the shipping or refund form, or the payment itself.'
			});
		}
		try {
			const id = await orderIdOf(event.params.ref);
			await moveOrder(id, to, {
				userId: user.id,
				why: why || `Moved to ${statusLabel(to)}`,
				expect
			});
			return { form: 'move', done: `Moved to ${statusLabel(to)}.` };
		} catch (err) {
			return refused(err, 'move');
		}
	},

	ship: async (event) => {
		const user = requireRole(event, 'owner', 'helper');
		const parsed = await parseForm(event.request, shipmentSchema, { extra: { form: 'ship' } });
		if (!parsed.ok) return parsed.failure;
		try {
			const s = await shipOrder(
				event.params.ref,
				parsed.data,
				{ userId: user.id },
				event.url.origin
			);
			return {
				form: 'ship',
				done: s.mailed
					? `Shipped. The buyer has an e-mail with tracking number ${s.trackingNumber}.`
					: 'Shipped, but the e-mail to the buyer could not be sent.'
			};
		} catch (err) {
			return refused(err, 'ship');
		}
	},

	refund: async (event) => {
		const user = requireRole(event, 'owner');
		const order = await workshopOrderDetail(event.params.ref);
		if (!order) return fail(404, { form: 'refund', error: 'There is no such order.' });
		const parsed = await parseForm(event.request, refundFormSchema(order.currency), {
			extra: { form: 'refund' }
		});
		if (!parsed.ok) return parsed.failure;
		try {
			const r = await refundOrder(
				event.params.ref,
				parsed.data,
				{ userId: user.id },
				event.url.origin
			);
			const money = (m: number) => formatMoney(m, order.currency);
			return {
				form: 'refund',
				done: `Refunded ${money(r.amountMinor)}; ${money(r.refundedMinor)} of ${money(r.totalMinor)} refunded in all. The buyer has an e-mail.`
			};
		} catch (err) {
			return refused(err, 'refund');
		}
	},

	returned: async (event) => {
		requireRole(event, 'owner');
		try {
			await markPiecesReturned(event.params.ref);
			return { form: 'returned', done: 'The ready-made pieces are back on the workshop shelf.' };
		} catch (err) {
			return refused(err, 'returned');
		}
	},

	balance: async (event) => {
		const user = requireRole(event, 'owner');
		const parsed = await parseForm(event.request, balanceSchema);
		if (!parsed.ok) return fail(400, { form: 'balance', error: firstError(parsed.errors) });
		try {
			await recordBalancePaid(event.params.ref, parsed.data.method, { userId: user.id });
			return { form: 'balance', done: 'Balance recorded as paid. The order can ship.' };
		} catch (err) {
			return refused(err, 'balance');
		}
	},

	/** Owner only, with a reason: a paid order is refunded in full through the refund code. */
	cancel: async (event) => {
		const user = requireRole(event, 'owner');
		const parsed = await parseForm(event.request, steerSchema, { extra: { form: 'cancel' } });
		if (!parsed.ok) return parsed.failure;
		try {
			const r = await cancelOrder(
				event.params.ref,
				parsed.data,
				{ userId: user.id },
				event.url.origin
			);
			return {
				form: 'cancel',
				done:
					r.refundedMinor === null
						? 'Cancelled. The pieces it held are back on the shelf.'
						: 'Cancelled and refunded in full. The buyer has an e-mail.'
			};
		} catch (err) {
			return refused(err, 'cancel');
		}
	},

	back: async (event) => {
		const user = requireRole(event, 'owner');
		const parsed = await parseForm(event.request, steerSchema, { extra: { form: 'back' } });
		if (!parsed.ok) return parsed.failure;
		try {
			const m = await stepBackOrder(event.params.ref, parsed.data, { userId: user.id });
			return { form: 'back', done: `Back to ${statusLabel(m.to)}.` };
		} catch (err) {
			return refused(err, 'back');
		}
	},

	note: async (event) => {
		const user = requireRole(event, 'owner', 'helper');
		const parsed = await parseForm(event.request, noteSchema, { extra: { form: 'note' } });
		if (!parsed.ok) return parsed.failure;
		try {
			await addOrderNote(event.params.ref, parsed.data.body, user.id);
			return { form: 'note', done: 'Note added.' };
		} catch (err) {
			return refused(err, 'note');
		}
	}
};
