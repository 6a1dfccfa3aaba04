import { fail } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/auth/guard';
import { closeFair, fairTally, saveTally } from '$lib/server/booth/tally';
import { fairIdParam, orFail, orPageError } from '$lib/server/booth/http';
import { assertFairAccess } from '$lib/server/fairs/fair-helpers';
import { parseTallyFields, tallyDaySchema } from '$lib/server/booth/tally-input';
import { closeCheck } from '$lib/server/booth/close-check';
import { countCheck, countingDay } from '$lib/booth/cash-up';
import { today } from '$lib/locale/dates';
import { formatMoney } from '$lib/locale/money';
import { formTexts } from '$lib/forms/parse-form';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'owner', 'helper');
	const id = fairIdParam(event.params.id);
	await orPageError(() => assertFairAccess(user, id));
	const t = await orPageError(() => fairTally(id));
	const owner = user.role === 'owner';
	const dayList = t.days.map((d) => d.day);
	const asked = tallyDaySchema.safeParse(event.url.searchParams.get('day'));
	const day =
		asked.success && dayList.includes(asked.data) ? asked.data : countingDay(dayList, today());
	const d = t.days.find((x) => x.day === day)!;
	const saved = d.tally !== null;
	const closed = Boolean(t.fair.closedAt);
	const money = (m: number) => formatMoney(m, t.fair.currency);
	const recountLeft = owner || (d.tally?.counts ?? 0) < 2;
	return {
		owner,
		fair: {
			id: t.fair.id,
			name: t.fair.name,
			currency: t.fair.currency,
			closed,
			salesTaxBp: t.fair.salesTaxBp,
			pricesIncludeTax: t.fair.pricesIncludeTax
		},
		days: t.days.map((x) => ({ day: x.day, counted: x.tally !== null })),
		day,
		saved,
		timesCounted: d.tally?.counts ?? 0,
		canCount: !closed && recountLeft,
		// A blind count: what the pieces and the tin should hold is shown only once counted.
		stock: d.result.stock.map((s) => ({
			key: s.key,
			label: s.label,
			counted: s.counted,
			...(saved
				? { expectedLeft: s.expectedLeft, difference: s.difference, verdict: s.verdict }
				: { expectedLeft: null, difference: null, verdict: null })
		})),
		cash: {
			counted: d.tally?.cashCountedMinor ?? null,
			firstCounted: d.tally?.firstCashCountedMinor ?? null,
			paidOut: d.tally?.cashPaidOutMinor ?? 0,
			cardReported: owner ? (d.tally?.cardReportedMinor ?? null) : null,
			difference: saved ? d.result.cash.difference : null
		},
		check: saved
			? countCheck(
					d.result.cash.difference,
					d.result.stockProblems,
					owner || closed ? 'none' : (d.tally?.counts ?? 0) < 2 ? 'left' : 'used',
					money
				)
			: null,
		flaggedSales: t.flaggedSales,
		lateSales: t.lateSales,
		// Only the owner sees what the money should be, the fees and the net.
		dayMoney: owner && saved ? { ...d.result, stock: undefined } : null,
		money: owner ? { ...t.result, stock: undefined } : null,
		manyDays: t.days.length > 1,
		closeCheck: owner && !closed ? await closeCheck(t) : null
	};
};

export const actions: Actions = {
	counts: async (event) => {
		const user = requireRole(event, 'owner', 'helper');
		const id = fairIdParam(event.params.id);
		const denied = await orFail(() => assertFairAccess(user, id));
		if (denied) return denied;
		const form = formTexts(await event.request.formData());
		const parsed = parseTallyFields(form, user.role === 'owner');
		if (!parsed.ok) return fail(400, { errors: parsed.errors });
		const day = tallyDaySchema.safeParse(form.day);
		const saveId = z.string().min(8).max(36).safeParse(form.saveId);
		return orFail(async () => {
			await saveTally(
				id,
				{
					...parsed.data,
					day: day.success ? day.data : undefined,
					saveId: saveId.success ? saveId.data : undefined
				},
				user
			);
			return { saved: true };
		});
	},
	close: async (event) => {
		const user = requireRole(event, 'owner');
		const id = fairIdParam(event.params.id);
		const form = formTexts(await event.request.formData());
		// Closing ends the fair for every day and phone: it is asked for twice, on purpose.
		if (form.confirm !== 'yes') return fail(400, { askClose: true });
		return orFail(async () => {
			await closeFair(id, user.id);
			return { closed: true };
		});
	}
};
