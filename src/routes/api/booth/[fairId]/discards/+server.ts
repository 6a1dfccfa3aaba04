import { json } from '@sveltejs/kit';
import { requireRoleApi } from '$lib/server/auth/guard';
import { apiError, apiInvalid } from '$lib/server/http/api-errors';
import { discardEntry } from '$lib/server/booth/void';
import { getFair } from '$lib/server/fairs/fairs';
import { readBoothJson } from '$lib/server/http/read-json';
import { FairError } from '$lib/server/booth/errors';
import { boothDiscardSchema } from '$lib/booth/sync-message';
import type { RequestHandler } from './$types';

/** A refused entry the helper discarded on the phone: kept so the owner still sees it. */
export const POST: RequestHandler = async (event) => {
	const user = requireRoleApi(event, 'owner', 'helper');
	const fairId = Number(event.params.fairId);
	if (!Number.isInteger(fairId) || fairId <= 0) return apiError(404, 'There is no such fair.');
	try {
		const parsed = boothDiscardSchema.safeParse(await readBoothJson(event.request));
		if (!parsed.success) return apiInvalid(parsed.error);
		await getFair(fairId);
		await discardEntry(fairId, parsed.data, user);
		return json({ status: 'kept' });
	} catch (err) {
		if (err instanceof FairError) return apiError(err.status, err.message);
		throw err;
	}
};
