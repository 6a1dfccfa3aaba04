import { json } from '@sveltejs/kit';
import { requireRoleApi } from '$lib/server/auth/guard';
import { apiError } from '$lib/server/http/api-errors';
import { syncSales } from '$lib/server/booth/sync';
import { readBoothJson } from '$lib/server/http/read-json';
import { FairError } from '$lib/server/booth/errors';
import { assertFairAccess } from '$lib/server/fairs/fair-helpers';
import { BOOTH_MAX_SALES, boothBatchSchema } from '$lib/booth/sync-message';
import type { RequestHandler } from './$types';

/** The booth's queue lands here: each sale stored once by its phone-made id. */
export const POST: RequestHandler = async (event) => {
	const user = requireRoleApi(event, 'owner', 'helper');
	const fairId = Number(event.params.fairId);
	if (!Number.isInteger(fairId) || fairId <= 0) return apiError(404, 'There is no such fair.');
	try {
		await assertFairAccess(user, fairId);
		const body = boothBatchSchema.safeParse(await readBoothJson(event.request));
		if (!body.success) return apiError(400, 'Send { "sales": [ ... ] }.');
		if (body.data.sales.length > BOOTH_MAX_SALES) {
			return apiError(
				413,
				`A batch may hold at most ${BOOTH_MAX_SALES} sales; this one has ${body.data.sales.length}. Send them in smaller batches (nothing was stored).`
			);
		}
		return json(await syncSales(fairId, body.data.sales, user));
	} catch (err) {
		if (err instanceof FairError) return apiError(err.status, err.message);
		throw err;
	}
};
