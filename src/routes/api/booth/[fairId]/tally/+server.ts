import { json } from '@sveltejs/kit';
import { requireRoleApi } from '$lib/server/auth/guard';
import { orApiError } from '$lib/server/http/api-errors';
import { readJson } from '$lib/server/http/read-json';
import { parseInput } from '$lib/server/errors/parse-input';
import { saveTally } from '$lib/server/booth/tally';
import { assertFairAccess } from '$lib/server/fairs/fair-helpers';
import { fairIdOf } from '$lib/server/fairs/fair-id';
import { tallyFieldsSchema, tallySaveSchema } from '$lib/booth/tally-input';
import type { RequestHandler } from './$types';

/** A day's count from the tally page (sent at once, or later from the phone's queue). */
export const POST: RequestHandler = (event) =>
	orApiError(async () => {
		const user = requireRoleApi(event, 'owner', 'helper');
		const fairId = fairIdOf(event.params.fairId);
		await assertFairAccess(user, fairId);
		const body = await readJson(event.request);
		const save = parseInput(tallySaveSchema, body, 'Send { "id", "day", "fields": { … } }.');
		const counted = parseInput(tallyFieldsSchema(user.role === 'owner'), save.fields);
		return json(await saveTally(fairId, { ...counted, day: save.day, saveId: save.id }, user));
	});
