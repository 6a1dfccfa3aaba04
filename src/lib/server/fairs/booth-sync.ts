import { formatDay } from '$lib/dates';
import { formatMoney, formatRate } from '$lib/money';
import { eq, inArray } from 'drizzle-orm';
import { db } from '../db';
import { boothSales, type Role } from '../db/schema';
import { isDuplicateKey, withRetry } from '../db/retry';
import { adjustStock, fairPlace } from '../stock/adjust';
import { boothSaleSchema, type BoothSale } from '$lib/schemas/fairs';
import { maxDiscount, priceSale } from '$lib/reconcile';
import { fairPieces, fairStateShared, getFair, type Fair, type FairPiece } from './fairs';
import { FairError } from './errors';

export type SyncAnswer = {
	accepted: string[];
	duplicate: string[];
	rejected: { id: string | null; error: string }[];
};

type Seller = { id: string; role: Role };

/** Fair refuses sales once closed; a short, plain reason the phone can show. */
export function assertOpen(fair: Fair) {
	if (fair.closedAt) {
		throw new FairError(
			`${fair.name} was closed on ${formatDay(fair.closedAt, 'medium')}; it takes no more sales.`,
			409
		);
	}
}

function priceEntry(
	sale: BoothSale,
	fair: Fair,
	catalogue: Map<string, FairPiece>,
	seller: Seller
) {
	const lines: { piece: FairPiece; quantity: number }[] = [];
	for (const l of sale.lines) {
		const piece = catalogue.get(`${l.pieceSlug}/${l.woodSlug}`);
		if (!piece)
			return { error: `${l.pieceSlug} in ${l.woodSlug} was not loaded out to this fair.` };
		lines.push({ piece, quantity: l.quantity });
	}
	const subtotal = lines.reduce((a, l) => a + l.piece.unitMinor * l.quantity, 0);
	const limit = seller.role === 'owner' ? subtotal : maxDiscount(subtotal, fair.helperDiscountBp);
	if (sale.discountMinor > limit) {
		return {
			error:
				seller.role === 'owner'
					? 'The discount is larger than the sale.'
					: `The discount is above the helpers’ limit of ${formatRate(fair.helperDiscountBp)} (${formatMoney(limit, fair.currency)} here).`
		};
	}
	const priced = priceSale(
		lines.map((l) => ({ unitMinor: l.piece.unitMinor, quantity: l.quantity })),
		sale.discountMinor,
		fair.salesTaxBp,
		fair.pricesIncludeTax
	);
	if (
		sale.method === 'cash' &&
		sale.tenderedMinor != null &&
		sale.tenderedMinor < priced.totalMinor
	) {
		return { error: 'The cash handed over is less than the sale’s total.' };
	}
	const at = new Date(sale.at);
	if (at.getTime() > Date.now() + 24 * 3_600_000)
		return { error: 'The sale time is in the future.' };
	return { lines, priced, at };
}

/**
 * Stores each sale of a batch once, however often and however concurrently it arrives. Each
 * sale is its own transaction: the row is inserted first under its phone-made id, so a second
 * copy waits on the key and then fails as a duplicate; fair stock moves in the same
 * transaction. A sale that takes fair stock below zero is stored and flagged (the buyer
 * already has the piece): the tally shows it.
 */
export async function syncSales(
	fairId: number,
	raw: unknown[],
	seller: Seller
): Promise<SyncAnswer> {
	const fair = await getFair(fairId);
	assertOpen(fair);
	const catalogue = new Map(
		(await fairPieces(fairId)).map((p) => [`${p.pieceSlug}/${p.woodSlug}`, p])
	);
	const answer: SyncAnswer = { accepted: [], duplicate: [], rejected: [] };

	const parsed = raw.map((r) => ({ r, p: boothSaleSchema.safeParse(r) }));
	const ids = parsed.flatMap(({ p }) => (p.success ? [p.data.id] : []));
	const known = new Map<string, number>();
	for (let i = 0; i < ids.length; i += 500) {
		const rows = await db
			.select({ id: boothSales.id, fairId: boothSales.fairId })
			.from(boothSales)
			.where(inArray(boothSales.id, ids.slice(i, i + 500)));
		for (const row of rows) known.set(row.id, row.fairId);
	}
	const seen = new Set<string>();

	for (const { r, p } of parsed) {
		if (!p.success) {
			const id =
				typeof (r as { id?: unknown })?.id === 'string'
					? (r as { id: string }).id.slice(0, 36)
					: null;
			const issue = p.error.issues[0];
			answer.rejected.push({ id, error: `${issue.path.join('.') || 'sale'}: ${issue.message}` });
			continue;
		}
		const sale = p.data;
		const duplicateOf = (otherFair: number) =>
			otherFair === fairId
				? answer.duplicate.push(sale.id)
				: answer.rejected.push({
						id: sale.id,
						error: 'This sale id was already used at another fair.'
					});
		if (known.has(sale.id)) {
			duplicateOf(known.get(sale.id)!);
			continue;
		}
		if (seen.has(sale.id)) {
			answer.duplicate.push(sale.id);
			continue;
		}
		seen.add(sale.id);
		const priced = priceEntry(sale, fair, catalogue, seller);
		if ('error' in priced) {
			answer.rejected.push({ id: sale.id, error: priced.error! });
			continue;
		}
		try {
			await withRetry(() => storeSale(fairId, sale, priced, seller));
			answer.accepted.push(sale.id);
		} catch (err) {
			if (isDuplicateKey(err)) {
				const [row] = await db
					.select({ fairId: boothSales.fairId })
					.from(boothSales)
					.where(eq(boothSales.id, sale.id));
				duplicateOf(row?.fairId ?? fairId);
			} else if (err instanceof FairError) {
				answer.rejected.push({ id: sale.id, error: err.message });
			} else throw err;
		}
	}
	return answer;
}

type Priced = Exclude<ReturnType<typeof priceEntry>, { error: string }>;

async function storeSale(fairId: number, sale: BoothSale, p: Priced, seller: Seller) {
	await db.transaction(async (tx) => {
		// Shares the fair row with other sales but waits for a close in progress (and vice versa).
		const fair = await fairStateShared(tx, fairId);
		if (fair.closedAt) throw new FairError(`${fair.name} is closed; it takes no more sales.`, 409);
		await tx.insert(boothSales).values({
			id: sale.id,
			fairId,
			kind: 'sale',
			method: sale.method,
			lines: p.lines.map((l) => ({
				pieceId: l.piece.pieceId,
				woodId: l.piece.woodId,
				quantity: l.quantity,
				unitPriceMinor: l.piece.unitMinor
			})),
			subtotalMinor: p.priced.subtotalMinor,
			discountMinor: p.priced.discountMinor,
			taxMinor: p.priced.taxMinor,
			totalMinor: p.priced.totalMinor,
			tenderedMinor: sale.method === 'cash' ? (sale.tenderedMinor ?? null) : null,
			soldAt: p.at,
			receivedAt: new Date(),
			recordedBy: seller.id
		});
		let flagged = false;
		const sorted = [...p.lines].sort(
			(a, b) => a.piece.pieceId - b.piece.pieceId || a.piece.woodId - b.piece.woodId
		);
		for (const l of sorted) {
			const r = await adjustStock(tx, {
				pieceId: l.piece.pieceId,
				woodId: l.piece.woodId,
				place: fairPlace(fairId),
				delta: -l.quantity,
				reason: `Booth sale ${sale.id}`,
				userId: seller.id,
				allowNegative: true
			});
			flagged ||= r.belowZero;
		}
		if (flagged)
			await tx.update(boothSales).set({ flagged: true }).where(eq(boothSales.id, sale.id));
	});
}
