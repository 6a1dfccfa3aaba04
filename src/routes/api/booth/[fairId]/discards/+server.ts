import { json } from '@sveltejs/kit';
import { requireRoleApi } from '$lib/server/auth/guard';
import { orApiError } from '$lib/server/http/api-errors';
import { readJson } from '$lib/server/http/read-json';
import { parseInput } from '$lib/server/errors/parse-input';
import { discardEntry } from '$lib/server/booth/void';
import { getFair } from '$lib/server/fairs/fairs';
import { fairIdOf } from '$lib/server/fairs/fair-id';
import { boothDiscardSchema } from '$lib/booth/sync-message';
import type { RequestHandler } from './$types';

/** A refused entry the helper discarded on the phone: kept so the owner still sees it. */
export const POST: RequestHandler = (event) =>
	orApiError(async () => {
		const user = requireRoleApi(event, 'owner', 'helper');
		const fairId = fairIdOf(event.params.fairId);
		const entry = parseInput(boothDiscardSchema, await readJson(event.request));
		await getFair(fairId);
		await discardEntry(fairId, entry, user);
		return json({ status: 'kept' });
	});
