import { z } from 'zod';
import { daysBetween } from '$lib/queue/carving-queue';
import { requireRole } from '$lib/server/auth/guard';
import { parseForm } from '$lib/forms/parse-form';
import { carvingQueue, setCarvingSchedule } from '$lib/server/queue/carving-queue';
import { alertHelperIds, setAlertOptIn } from '$lib/server/orders/paid-alert';
import { carvingHoursForm } from '$lib/queue/carving-hours-schema';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'owner', 'helper');
	const [queue, helpers] = await Promise.all([carvingQueue(), alertHelperIds()]);
	return {
		role: user.role,
		queue,
		alertsOn: user.role === 'owner' || helpers.includes(user.id)
	};
};

/** The tick box: on when sent as "yes", off when left out. */
const alertsForm = z.object({
	on: z
		.string()
		.optional()
		.transform((v) => v === 'yes')
});

export const actions: Actions = {
	/** The owner's carving week: changing it re-dates every queued order. */
	hours: async (event) => {
		requireRole(event, 'owner');
		const parsed = await parseForm(event.request, carvingHoursForm);
		if (!parsed.ok) return parsed.failure;
		const v = parsed.data;
		const mins = (h: number) => Math.round(h * 60);
		await setCarvingSchedule({
			minutesByWeekday: [
				mins(v.h0),
				mins(v.h1),
				mins(v.h2),
				mins(v.h3),
				mins(v.h4),
				mins(v.h5),
				mins(v.h6)
			],
			daysOff: [
				...new Set(
					v.daysOff.flatMap((d) =>
						d.includes('..') ? daysBetween(...(d.split('..') as [string, string])) : [d]
					)
				)
			].sort(),
			finishingDays: v.finishingDays,
			packingDays: v.packingDays,
			surchargePerMinuteMinor: v.surchargeCents
		});
		return { saved: 'Saved. Every order in the queue has a new ready-by date.' };
	},

	/** A helper asks for (or stops) an e-mail on each paid order; the owner always gets one. */
	alerts: async (event) => {
		const user = requireRole(event, 'owner', 'helper');
		const parsed = await parseForm(event.request, alertsForm);
		if (!parsed.ok) return parsed.failure;
		const { on } = parsed.data;
		if (user.role === 'helper') await setAlertOptIn(user.id, on);
		return { saved: on ? 'You will get an e-mail for each paid order.' : 'No more order e-mails.' };
	}
};
