/**
 * Voiding a booth sale (a slip, a double tap, a refund at the table): the sale stays, marked
 * void with who, when and why; it leaves takings, tax and method totals; its pieces go back to
 * stock through adjustStock. Made on the phone with its own id, so a resent void is stored once.
 */
import { and, desc, eq, isNotNull } from 'drizzle-orm';
import { db } from '../db';
import { boothDiscards, boothSales, fairs, users, type Role } from '../db/schema';
import { formatMoney } from '$lib/locale/money';
import { formatMoment } from '$lib/locale/dates';
import { transact } from '../db/retry';
import { voidRefusal } from '$lib/booth/rules';
import type { BoothVoid } from '$lib/booth/sync-message';
import { fairStateShared } from '../fairs/fairs';
import { moveStock } from './sync';
import { DomainError } from '../errors/domain-error';

export async function voidSale(
	fairId: number,
	v: BoothVoid,
	by: { id: string; role: Role },
	now = new Date()
): Promise<{ status: 'voided' | 'duplicate' }> {
	return transact(async (tx) => {
		const fair = await fairStateShared(tx, fairId);
		const [sale] = await tx
			.select()
			.from(boothSales)
			.where(and(eq(boothSales.id, v.saleId), eq(boothSales.fairId, fairId)))
			.for('update');
		if (!sale) throw new DomainError(404, 'There is no such sale at this fair.');
		if (sale.kind !== 'sale')
			throw new DomainError(
				400,
				'A deposit belongs to its order; refund it from the order’s page.'
			);
		if (sale.voidedAt) return { status: 'duplicate' as const };
		const refusal = voidRefusal(by.role, sale.soldAt, new Date(v.at), now);
		if (refusal) throw new DomainError(403, refusal);
		const closed = Boolean(fair.closedAt);
		const lines = [...sale.lines].sort((a, b) => a.pieceId - b.pieceId || a.woodId - b.woodId);
		for (const l of lines)
			await moveStock(tx, fairId, l, l.quantity, closed, {
				reason: `Void of booth sale ${sale.id}`,
				userId: by.id
			});
		await tx
			.update(boothSales)
			.set({
				voidedAt: new Date(Math.floor(now.getTime() / 1000) * 1000),
				voidedBy: by.id,
				voidReason: v.reason,
				voidId: v.id
			})
			.where(eq(boothSales.id, sale.id));
		return { status: 'voided' as const };
	});
}

/** Keeps a refused entry the helper discarded, for the owner; a resend stores it once. */
export async function discardEntry(
	fairId: number,
	d: { id: string; kind: 'sale' | 'deposit'; summary: string; reason: string },
	by: { id: string }
) {
	await db
		.insert(boothDiscards)
		.values({ ...d, fairId, discardedBy: by.id, discardedAt: new Date() })
		.onDuplicateKeyUpdate({ set: { id: d.id } });
}

/** The fair's history of corrections: voids and discarded entries, with who did them. */
export async function fairCorrections(fairId: number) {
	const [voids, discards] = await Promise.all([
		db
			.select({
				id: boothSales.id,
				soldAt: boothSales.soldAt,
				totalMinor: boothSales.totalMinor,
				method: boothSales.method,
				voidedAt: boothSales.voidedAt,
				reason: boothSales.voidReason,
				by: users.name
			})
			.from(boothSales)
			.leftJoin(users, eq(users.id, boothSales.voidedBy))
			.where(and(eq(boothSales.fairId, fairId), isNotNull(boothSales.voidedAt)))
			.orderBy(desc(boothSales.voidedAt)),
		db
			.select({
				id: boothDiscards.id,
				kind: boothDiscards.kind,
				summary: boothDiscards.summary,
				reason: boothDiscards.reason,
				at: boothDiscards.discardedAt,
				by: users.name
			})
			.from(boothDiscards)
			.leftJoin(users, eq(users.id, boothDiscards.discardedBy))
			.where(eq(boothDiscards.fairId, fairId))
			.orderBy(desc(boothDiscards.discardedAt))
	]);
	return { voids, discards };
}

/** The fair's history in words, newest first: voids, late sales and discarded entries. */
export async function fairHistory(fairId: number) {
	const [fair] = await db
		.select({ currency: fairs.currency })
		.from(fairs)
		.where(eq(fairs.id, fairId));
	const { voids, discards } = await fairCorrections(fairId);
	const late = await db
		.select({ id: boothSales.id, soldAt: boothSales.soldAt, receivedAt: boothSales.receivedAt })
		.from(boothSales)
		.where(and(eq(boothSales.fairId, fairId), eq(boothSales.late, true)));
	const money = (m: number) => formatMoney(m, fair?.currency);
	const items = [
		...voids.map((v) => ({
			at: v.voidedAt ?? v.soldAt,
			words: `${v.by ?? 'Someone no longer here'} voided a ${v.method} sale of ${money(v.totalMinor)}: ${v.reason ?? ''}`
		})),
		...discards.map((d) => ({
			at: d.at,
			words: `${d.by ?? 'Someone no longer here'} discarded a refused entry (${d.summary}); refused because: ${d.reason}`
		})),
		...late.map((l) => ({
			at: l.receivedAt ?? l.soldAt,
			words: `A sale made ${formatMoment(l.soldAt)} arrived after the close and was counted.`
		}))
	];
	return items.sort((a, b) => b.at.getTime() - a.at.getTime());
}
