import { json } from '@sveltejs/kit';
import { requireRoleApi } from '$lib/server/auth/guard';
import { orApiError } from '$lib/server/http/api-errors';
import { readJson } from '$lib/server/http/read-json';
import { parseInput } from '$lib/server/errors/parse-input';
import { voidSale } from '$lib/server/booth/void';
import { fairIdOf } from '$lib/server/fairs/fair-id';
import { boothVoidSchema } from '$lib/booth/sync-message';
import type { RequestHandler } from './$types';

/** A void of a booth sale, queued on the phone like a sale; resending it stores nothing new. */
export const POST: RequestHandler = (event) =>
	orApiError(async () => {
		const user = requireRoleApi(event, 'owner', 'helper');
		const fairId = fairIdOf(event.params.fairId);
		const entry = parseInput(boothVoidSchema, await readJson(event.request));
		return json(await voidSale(fairId, entry, user));
	});
