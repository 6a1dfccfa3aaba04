import { json } from '@sveltejs/kit';
import { requireRoleApi } from '$lib/server/auth/guard';
import { orApiError } from '$lib/server/http/api-errors';
import { readJson } from '$lib/server/http/read-json';
import { parseInput } from '$lib/server/errors/parse-input';
import { placeBoothOrder } from '$lib/server/booth/order';
import { assertFairAccess } from '$lib/server/fairs/fair-helpers';
import { fairIdOf } from '$lib/server/fairs/fair-id';
import { boothOrderSchema } from '$lib/booth/sync-message';
import type { RequestHandler } from './$types';

/** A personalised order taken at the booth, with its deposit; resending it stores nothing new. */
export const POST: RequestHandler = (event) =>
	orApiError(async () => {
		const user = requireRoleApi(event, 'owner', 'helper');
		const fairId = fairIdOf(event.params.fairId);
		await assertFairAccess(user, fairId);
		const order = parseInput(boothOrderSchema, await readJson(event.request));
		return json(await placeBoothOrder(fairId, order, user, event.url.origin));
	});
