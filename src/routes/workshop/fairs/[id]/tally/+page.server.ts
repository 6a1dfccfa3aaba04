import { fail } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import { closeFair, fairTally, saveTally } from '$lib/server/fairs/tally';
import { fairIdParam, orFail, orPageError } from '$lib/server/fairs/http';
import { countSchema, moneyField, tallyFormSchema } from '$lib/schemas/fairs';
import { formTexts } from '$lib/forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'owner', 'helper');
	const id = fairIdParam(event.params.id);
	const t = await orPageError(() => fairTally(id));
	const owner = user.role === 'owner';
	return {
		owner,
		fair: {
			id: t.fair.id,
			name: t.fair.name,
			currency: t.fair.currency,
			closed: Boolean(t.fair.closedAt),
			salesTaxBp: t.fair.salesTaxBp,
			pricesIncludeTax: t.fair.pricesIncludeTax
		},
		stock: t.result.stock,
		flaggedSales: t.flaggedSales,
		lateSales: t.lateSales,
		entered: {
			cashCounted: t.tally?.cashCountedMinor ?? null,
			cashPaidOut: t.tally?.cashPaidOutMinor ?? 0,
			cardReported: owner ? (t.tally?.cardReportedMinor ?? null) : null
		},
		// Helpers count; only the owner sees what the money should be, the fees and the net.
		money: owner ? { ...t.result, stock: undefined } : null
	};
};

export const actions: Actions = {
	counts: async (event) => {
		const user = requireRole(event, 'owner', 'helper');
		const id = fairIdParam(event.params.id);
		const form = formTexts(await event.request.formData());
		const errors: Record<string, string> = {};
		const counts: Record<number, number> = {};
		// One count per stock row (count-<id>), each parsed on its own.
		for (const [key, value] of Object.entries(form)) {
			const m = /^count-(\d+)$/.exec(key);
			if (!m || value.trim() === '') continue;
			const n = countSchema.safeParse(value.trim());
			if (n.success) counts[Number(m[1])] = n.data;
			else errors[key] = n.error.issues[0].message;
		}
		const money = tallyFormSchema.safeParse({
			cashCounted: form.cashCounted ?? '',
			cashPaidOut: form.cashPaidOut ?? '',
			cardReported: form.cardReported ?? ''
		});
		if (!money.success) for (const i of money.error.issues) errors[String(i.path[0])] = i.message;
		let cardReportedMinor: number | null | undefined = undefined;
		if (user.role === 'owner' && money.success) {
			const raw = money.data.cardReported ?? '';
			if (raw === '') cardReportedMinor = null;
			else {
				const card = moneyField('the card reader’s total').safeParse(raw);
				if (card.success) cardReportedMinor = card.data;
				else errors.cardReported = card.error.issues[0].message;
			}
		}
		if (Object.keys(errors).length || !money.success) return fail(400, { errors });
		const cashGiven = (form.cashCounted ?? '').trim() !== '';
		return orFail(async () => {
			await saveTally(
				id,
				{
					counts,
					cashCountedMinor: cashGiven ? money.data.cashCounted : undefined,
					cashPaidOutMinor: money.data.cashPaidOut,
					cardReportedMinor
				},
				user.id
			);
			return { saved: true };
		});
	},
	close: async (event) => {
		const user = requireRole(event, 'owner');
		const id = fairIdParam(event.params.id);
		return orFail(async () => {
			await closeFair(id, user.id);
			return { closed: true };
		});
	}
};
