import { json } from '@sveltejs/kit';
import { requireRoleApi } from '$lib/server/auth/guard';
import { apiError, apiInvalid } from '$lib/server/http/api-errors';
import { placeBoothOrder } from '$lib/server/booth/order';
import { readBoothJson } from '$lib/server/http/read-json';
import { FairError } from '$lib/server/booth/errors';
import { assertFairAccess } from '$lib/server/fairs/fair-helpers';
import { boothOrderSchema } from '$lib/booth/sync-message';
import type { RequestHandler } from './$types';

/** A personalised order taken at the booth, with its deposit; resending it stores nothing new. */
export const POST: RequestHandler = async (event) => {
	const user = requireRoleApi(event, 'owner', 'helper');
	const fairId = Number(event.params.fairId);
	if (!Number.isInteger(fairId) || fairId <= 0) return apiError(404, 'There is no such fair.');
	try {
		await assertFairAccess(user, fairId);
		const parsed = boothOrderSchema.safeParse(await readBoothJson(event.request));
		if (!parsed.success) return apiInvalid(parsed.error);
		return json(await placeBoothOrder(fairId, parsed.data, user, event.url.origin));
	} catch (err) {
		if (err instanceof FairError) return apiError(err.status, err.message);
		throw err;
	}
};
