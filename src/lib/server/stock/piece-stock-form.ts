import { error, fail } from '@sveltejs/kit';
import { fieldErrors, formTexts } from '$lib/forms/parse-form';
import { stockAdjustForm, stockDelta } from '$lib/stock/stock-schema';
import { adjustPieceStock, StockChangeError, type FairForStock } from './piece-stock';

/**
 * The piece page's stock panel: reads the change, makes it with the reason and who made it, and
 * answers a refusal (below zero, a closed fair) beside the field it is about, with what was typed.
 */
export async function pieceStockForm(
	request: Request,
	pieceId: number,
	userId: string,
	fairForStock: FairForStock
) {
	const values = formTexts(await request.formData());
	const parsed = stockAdjustForm.safeParse(values);
	if (!parsed.success) {
		return fail(400, { stockErrors: fieldErrors(parsed.error), stockValues: values });
	}
	const { woodId, place, reason } = parsed.data;
	try {
		const r = await adjustPieceStock(
			pieceId,
			{ woodId, place, reason, delta: stockDelta(parsed.data) },
			userId,
			fairForStock
		);
		return { stockSaved: r.quantity };
	} catch (err) {
		if (!(err instanceof StockChangeError)) throw err;
		if (err.status === 404) error(404, err.message);
		return fail(err.status, {
			stockErrors: { [err.field ?? 'form']: [err.message] },
			stockValues: values
		});
	}
}
