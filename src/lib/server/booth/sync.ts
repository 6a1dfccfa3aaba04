import { createHash } from 'node:crypto';
import { formatMoney, formatRate } from '$lib/locale/money';
import { and, eq, inArray } from 'drizzle-orm';
import { db, type Tx } from '../db';
import { boothSales, fairStock, type Role } from '../db/schema';
import { isDuplicateKey, transact } from '../db/retry';
import { adjustStock, fairPlace } from '../stock/adjust';
import { boothSaleSchema, type BoothSale, type SyncAnswer } from '$lib/booth/sync-message';
import { maxDiscount, priceSale } from '$lib/booth/reconcile';
import { lateVerdict, saleFingerprint, saleTimeProblem } from '$lib/booth/rules';
import { fairPieces, fairStateShared, getFair, type Fair, type FairPiece } from '../fairs/fairs';
import { sendReceipt } from './receipt';
import { DomainError } from '../errors/domain-error';

type Seller = { id: string; role: Role };

export const contentHash = (s: BoothSale) =>
	createHash('sha256').update(saleFingerprint(s)).digest('hex');

function priceEntry(
	sale: BoothSale,
	fair: Fair,
	catalogue: Map<string, FairPiece>,
	seller: Seller
) {
	const at = new Date(sale.at);
	const when = saleTimeProblem(at, fair);
	if (when) return { error: when };
	if (lateVerdict(at, fair.closedAt) === 'after close')
		return {
			error: `${fair.name} was closed before this sale was made; it takes no sales after the close.`
		};
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
	const card = sale.cardPartMinor ?? null;
	if (card !== null) {
		if (sale.method !== 'cash')
			return { error: 'A split payment is recorded as cash with a card part.' };
		if (card >= priced.totalMinor)
			return { error: 'The card part of a split payment must be less than the total.' };
	}
	const cashDue = priced.totalMinor - (card ?? 0);
	if (sale.method === 'cash' && sale.tenderedMinor != null && sale.tenderedMinor < cashDue) {
		return { error: 'The cash handed over is less than the cash part of the sale.' };
	}
	return { lines, priced, at, card };
}

/**
 * Stores each sale of a batch once, however often and however concurrently it arrives. Each
 * sale is its own transaction: the row is inserted first under its phone-made id, so a second
 * copy waits on the key and then fails as a duplicate; fair stock moves in the same
 * transaction. A resend of a stored sale is "duplicate" whatever the fair's state; the same id
 * with other content is a conflict. A sale made before the close is taken after it, marked late.
 * A sale that takes fair stock below zero is stored and flagged (the buyer already has the
 * piece): the tally shows it.
 */
export async function syncSales(
	fairId: number,
	raw: unknown[],
	seller: Seller
): Promise<SyncAnswer> {
	const fair = await getFair(fairId);
	const catalogue = new Map(
		(await fairPieces(fairId)).map((p) => [`${p.pieceSlug}/${p.woodSlug}`, p])
	);
	const answer: SyncAnswer = { accepted: [], duplicate: [], late: [], rejected: [] };

	const parsed = raw.map((r) => ({ r, p: boothSaleSchema.safeParse(r) }));
	const ids = parsed.flatMap(({ p }) => (p.success ? [p.data.id] : []));
	const known = new Map<string, { fairId: number; hash: string | null; kind: string }>();
	for (let i = 0; i < ids.length; i += 500) {
		const rows = await db
			.select({
				id: boothSales.id,
				fairId: boothSales.fairId,
				hash: boothSales.contentHash,
				kind: boothSales.kind
			})
			.from(boothSales)
			.where(inArray(boothSales.id, ids.slice(i, i + 500)));
		for (const row of rows) known.set(row.id, row);
	}
	const seen = new Map<string, string>();

	const stored = (sale: BoothSale, row: { fairId: number; hash: string | null; kind: string }) => {
		if (row.fairId !== fairId || row.kind !== 'sale')
			answer.rejected.push({ id: sale.id, error: 'This sale id was already used elsewhere.' });
		else if (row.hash && row.hash !== contentHash(sale))
			answer.rejected.push({
				id: sale.id,
				conflict: true,
				error:
					'A different sale was already stored under this id; this copy was not stored. Check it and record it again if it was a real sale.'
			});
		else answer.duplicate.push(sale.id);
	};

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
		const row = known.get(sale.id);
		if (row) {
			stored(sale, row);
			continue;
		}
		const before = seen.get(sale.id);
		if (before !== undefined) {
			stored(sale, { fairId, hash: before, kind: 'sale' });
			continue;
		}
		seen.set(sale.id, contentHash(sale));
		const priced = priceEntry(sale, fair, catalogue, seller);
		if ('error' in priced) {
			answer.rejected.push({ id: sale.id, error: priced.error! });
			continue;
		}
		try {
			const late = await storeSale(fairId, sale, priced, seller);
			answer.accepted.push(sale.id);
			if (late) answer.late.push(sale.id);
			if (sale.receiptEmail) await sendReceipt(sale.id);
		} catch (err) {
			if (isDuplicateKey(err)) {
				const [again] = await db
					.select({
						fairId: boothSales.fairId,
						hash: boothSales.contentHash,
						kind: boothSales.kind
					})
					.from(boothSales)
					.where(eq(boothSales.id, sale.id));
				stored(sale, again ?? { fairId, hash: null, kind: 'sale' });
			} else if (err instanceof DomainError) {
				answer.rejected.push({ id: sale.id, error: err.message });
			} else throw err;
		}
	}
	return answer;
}

type Priced = Exclude<ReturnType<typeof priceEntry>, { error: string }>;

/** Returns true when the sale arrived after the close (late). */
async function storeSale(fairId: number, sale: BoothSale, p: Priced, seller: Seller) {
	return transact(async (tx) => {
		// Shares the fair row with other sales but waits for a close in progress (and vice versa).
		const fair = await fairStateShared(tx, fairId);
		const verdict = lateVerdict(p.at, fair.closedAt);
		if (verdict === 'after close')
			throw new DomainError(409, `${fair.name} was closed before this sale was made.`);
		const late = verdict === 'late';
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
			cardPartMinor: p.card,
			receiptEmail: sale.receiptEmail || null,
			contentHash: contentHash(sale),
			late,
			soldAt: p.at,
			receivedAt: new Date(),
			recordedBy: seller.id
		});
		let flagged = false;
		const sorted = [...p.lines].sort(
			(a, b) => a.piece.pieceId - b.piece.pieceId || a.piece.woodId - b.piece.woodId
		);
		for (const l of sorted) {
			const moved = await moveStock(tx, fairId, l.piece, -l.quantity, late, {
				reason: `Booth sale ${sale.id}${late ? ', arrived after the close' : ''}`,
				userId: seller.id
			});
			flagged ||= moved;
		}
		if (flagged)
			await tx.update(boothSales).set({ flagged: true }).where(eq(boothSales.id, sale.id));
		return late;
	});
}

/**
 * Moves a sold (negative) or voided (positive) count for one line. While the fair is open that
 * is the fair's stock. After the close its stock went home: where the helper counted the line
 * back, the count already saw the piece go (or stay), so nothing moves; where nobody counted,
 * the close sent home what the fair's stock showed, so the workshop's shelf is corrected.
 * Returns true when a count went below zero.
 */
export async function moveStock(
	tx: Tx,
	fairId: number,
	piece: { pieceId: number; woodId: number },
	delta: number,
	closed: boolean,
	why: { reason: string; userId: string }
): Promise<boolean> {
	let place = fairPlace(fairId);
	if (closed) {
		const [line] = await tx
			.select({ countedBack: fairStock.countedBack })
			.from(fairStock)
			.where(
				and(
					eq(fairStock.fairId, fairId),
					eq(fairStock.pieceId, piece.pieceId),
					eq(fairStock.woodId, piece.woodId)
				)
			);
		if (line?.countedBack != null) return false;
		place = 'workshop';
	}
	const r = await adjustStock(tx, {
		pieceId: piece.pieceId,
		woodId: piece.woodId,
		place,
		delta,
		reason: why.reason.slice(0, 200),
		userId: why.userId,
		allowNegative: true
	});
	return r.belowZero;
}
