import { error } from '@sveltejs/kit';
import { parseForm } from '$lib/forms/parse-form';
import { stockAdjustForm, stockDelta } from '$lib/stock/stock-schema';
import { DomainError } from '../errors/domain-error';
import { failFrom } from '../errors/form-answer';
import { adjustPieceStock, type FairForStock } from './piece-stock';

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
	const parsed = await parseForm(request, stockAdjustForm, { extra: { form: 'stock' } });
	if (!parsed.ok) return parsed.failure;
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
		if (!(err instanceof DomainError)) throw err;
		if (err.status === 404) error(404, err.message);
		return failFrom(err, { form: 'stock', values: parsed.values });
	}
}
