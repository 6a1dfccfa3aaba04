import { z } from 'zod';
import { parseForm } from '$lib/forms/parse-form';
import { requireRole } from '$lib/server/auth/guard';
import { todaySummary } from '$lib/server/workshop/today';
import { retryUndelivered, sendQueued, undeliveredMail } from '$lib/server/mail/outbox';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'owner', 'helper');
	// Mail the outbox gave up on: the owner's to deal with, so only the owner sees it.
	const [summary, undelivered] = await Promise.all([
		todaySummary(),
		user.role === 'owner' ? undeliveredMail() : Promise.resolve([])
	]);
	return { name: user.name, role: user.role, summary, undelivered };
};

const GONE = 'That message could not be found.';
const retryForm = z.object({ id: z.coerce.number({ error: GONE }).int(GONE).positive(GONE) });

export const actions: Actions = {
	/** "Try again" on a message the outbox gave up on: pending again, and tried at once. */
	retryMail: async (event) => {
		requireRole(event, 'owner');
		const parsed = await parseForm(event.request, retryForm);
		if (!parsed.ok) return parsed.failure;
		const { id } = parsed.data;
		// False when it is no longer given up (a second tap, or another tab already retried it).
		if (await retryUndelivered(id)) await sendQueued([id]);
		return { retried: id };
	}
};
