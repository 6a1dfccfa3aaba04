import { json } from '@sveltejs/kit';
import { requireRoleApi } from '$lib/server/auth/guard';
import { apiError, apiInvalid } from '$lib/server/http/api-errors';
import { voidSale } from '$lib/server/booth/void';
import { readBoothJson } from '$lib/server/http/read-json';
import { FairError } from '$lib/server/booth/errors';
import { boothVoidSchema } from '$lib/booth/sync-message';
import type { RequestHandler } from './$types';

/** A void of a booth sale, queued on the phone like a sale; resending it stores nothing new. */
export const POST: RequestHandler = async (event) => {
	const user = requireRoleApi(event, 'owner', 'helper');
	const fairId = Number(event.params.fairId);
	if (!Number.isInteger(fairId) || fairId <= 0) return apiError(404, 'There is no such fair.');
	try {
		const parsed = boothVoidSchema.safeParse(await readBoothJson(event.request));
		if (!parsed.success) return apiInvalid(parsed.error);
		return json(await voidSale(fairId, parsed.data, user));
	} catch (err) {
		if (err instanceof FairError) return apiError(err.status, err.message);
		throw err;
	}
};
