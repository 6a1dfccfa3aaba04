/**
 * What the tally page shows for one fair day: a blind count until the day is counted, then what
 * the pieces and the tin should hold; the money, fees and net for the owner only.
 */
import { countCheck, countingDay } from '$lib/booth/cash-up';
import { tallyDaySchema } from '$lib/booth/tally-input';
import { today } from '$lib/locale/dates';
import { formatMoney } from '$lib/locale/money';
import { closeCheck } from './close-check';
import { fairTally } from './tally';

/** `askedDay` is the `?day=` the page was opened with (any other text counts the nearest day). */
export async function tallyPage(fairId: number, owner: boolean, askedDay: string | null) {
	const t = await fairTally(fairId);
	const dayList = t.days.map((d) => d.day);
	const asked = tallyDaySchema.safeParse(askedDay);
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
}
