import { json } from '@sveltejs/kit';
import { requireRoleApi } from '$lib/server/auth/guard';
import { apiError, apiInvalid } from '$lib/server/http/api-errors';
import { OrderNotFoundError, shipOrder, StatusMoveError } from '$lib/server/orders/ship';
import { shipmentSchema } from '$lib/orders/shipment-schema';
import type { RequestHandler } from './$types';

/** Marks the order shipped with its carrier and tracking number; the buyer gets an e-mail. */
export const POST: RequestHandler = async (event) => {
	const user = requireRoleApi(event, 'owner', 'helper');
	const body: unknown = await event.request.json().catch(() => null);
	if (!body || typeof body !== 'object') return apiError(400, 'Send a JSON object.');
	const parsed = shipmentSchema.safeParse(body);
	if (!parsed.success) {
		return apiInvalid(parsed.error, 'Check the carrier and tracking number.');
	}
	try {
		const shipment = await shipOrder(
			event.params.ref,
			parsed.data,
			{ userId: user.id },
			event.url.origin
		);
		return json({ shipment }, { status: 201 });
	} catch (err) {
		if (err instanceof OrderNotFoundError || err instanceof StatusMoveError) {
			return apiError(err.status, err.message);
		}
		throw err;
	}
};
