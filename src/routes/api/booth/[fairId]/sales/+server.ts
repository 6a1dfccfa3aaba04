import { json } from '@sveltejs/kit';
import { requireRoleApi } from '$lib/server/auth/guard';
import { apiError, orApiError } from '$lib/server/http/api-errors';
import { readJson } from '$lib/server/http/read-json';
import { parseInput } from '$lib/server/errors/parse-input';
import { syncSales } from '$lib/server/booth/sync';
import { assertFairAccess } from '$lib/server/fairs/fair-helpers';
import { fairIdOf } from '$lib/server/fairs/fair-id';
import { BOOTH_MAX_SALES, boothBatchSchema } from '$lib/booth/sync-message';
import type { RequestHandler } from './$types';

/** The booth's queue lands here: each sale stored once by its phone-made id. */
export const POST: RequestHandler = (event) =>
	orApiError(async () => {
		const user = requireRoleApi(event, 'owner', 'helper');
		const fairId = fairIdOf(event.params.fairId);
		await assertFairAccess(user, fairId);
		const body = await readJson(event.request);
		const { sales } = parseInput(boothBatchSchema, body, 'Send { "sales": [ ... ] }.');
		if (sales.length > BOOTH_MAX_SALES) {
			return apiError(
				413,
				`A batch may hold at most ${BOOTH_MAX_SALES} sales; this one has ${sales.length}. Send them in smaller batches (nothing was stored).`
			);
		}
		return json(await syncSales(fairId, sales, user));
	});
