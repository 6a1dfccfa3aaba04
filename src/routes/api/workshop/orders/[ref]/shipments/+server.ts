import { json } from '@sveltejs/kit';
import { requireRoleApi } from '$lib/server/auth/guard';
import { orApiError } from '$lib/server/http/api-errors';
import { readJson } from '$lib/server/http/read-json';
import { parseInput } from '$lib/server/errors/parse-input';
import { shipOrder } from '$lib/server/orders/ship';
import { shipmentSchema } from '$lib/orders/shipment-schema';
import type { RequestHandler } from './$types';

/** Marks the order shipped with its carrier and tracking number; the buyer gets an e-mail. */
export const POST: RequestHandler = (event) =>
	orApiError(async () => {
		const user = requireRoleApi(event, 'owner', 'helper');
		const input = parseInput(
			shipmentSchema,
			await readJson(event.request),
			'Check the carrier and tracking number.'
		);
		const { ref } = event.params;
		const shipment = await shipOrder(ref, input, { userId: user.id }, event.url.origin);
		return json({ shipment }, { status: 201 });
	});
