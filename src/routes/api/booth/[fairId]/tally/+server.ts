import { json } from '@sveltejs/kit';
import { requireRoleApi } from '$lib/server/auth/guard';
import { apiError } from '$lib/server/http/api-errors';
import { saveTally } from '$lib/server/booth/tally';
import { parseTallyFields, tallySaveSchema } from '$lib/server/booth/tally-input';
import { readBoothJson } from '$lib/server/http/read-json';
import { FairError } from '$lib/server/booth/errors';
import { assertFairAccess } from '$lib/server/fairs/fair-helpers';
import type { RequestHandler } from './$types';

/** A day's count from the tally page (sent at once, or later from the phone's queue). */
export const POST: RequestHandler = async (event) => {
	const user = requireRoleApi(event, 'owner', 'helper');
	const fairId = Number(event.params.fairId);
	if (!Number.isInteger(fairId) || fairId <= 0) return apiError(404, 'There is no such fair.');
	try {
		await assertFairAccess(user, fairId);
		const body = tallySaveSchema.safeParse(await readBoothJson(event.request));
		if (!body.success) return apiError(400, 'Send { "id", "day", "fields": { … } }.');
		const parsed = parseTallyFields(body.data.fields, user.role === 'owner');
		if (!parsed.ok)
			return apiError(
				400,
				Object.values(parsed.errors)[0],
				Object.fromEntries(Object.entries(parsed.errors).map(([k, v]) => [k, [v]]))
			);
		const saved = await saveTally(
			fairId,
			{ ...parsed.data, day: body.data.day, saveId: body.data.id },
			user
		);
		return json(saved);
	} catch (err) {
		if (err instanceof FairError) return apiError(err.status, err.message);
		throw err;
	}
};
