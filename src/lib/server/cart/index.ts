import type { Cookies } from '@sveltejs/kit';
import { and, asc, eq, inArray, isNull, sql } from 'drizzle-orm';
import { db } from '../db';
import {
	cartLines,
	carts,
	photos,
	pieces,
	pieceWoods,
	woods,
	type Personalisation
} from '../db/schema';
import { priceCart } from './pricing';
import { stockOnHand } from '../stock/holds';
import { personalise, previewSvg, snapshotRefusal } from '../catalogue/personalise';
import { HOME_COUNTRY } from '$lib/catalogue/shipping';
import { basketReadyBy, carvedMinutes, readyByNow } from '../queue/carving-queue';
import { BASKET_LIFETIME_MS } from './checkout-details';
import { DomainError } from '../errors/domain-error';

export const CART_COOKIE = 'cart';
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

export function cartIdFrom(cookies: Cookies): string | null {
	const id = cookies.get(CART_COOKIE);
	return id && UUID.test(id) ? id : null;
}

/** The visitor's cart id, creating the cart (and its cookie) on first use. */
export async function ensureCart(cookies: Cookies, userId: string | null, secure: boolean) {
	const existing = cartIdFrom(cookies);
	if (existing) {
		const [row] = await db.select({ id: carts.id }).from(carts).where(eq(carts.id, existing));
		if (row) return existing;
	}
	const id = crypto.randomUUID();
	const now = new Date();
	await db.insert(carts).values({ id, userId, createdAt: now, updatedAt: now });
	cookies.set(CART_COOKIE, id, {
		path: '/',
		httpOnly: true,
		sameSite: 'lax',
		secure,
		maxAge: BASKET_LIFETIME_MS / 1000
	});
	return id;
}

export type AddLineInput = {
	slug: string;
	wood: string;
	quantity: number;
	initials?: string;
	style?: string;
};

/**
 * Adds a piece. With initials the server recomputes the whole pattern from the piece's layout
 * and stores that snapshot; without, the piece must be on hand as finished stock.
 */
export async function addLine(cartId: string, input: AddLineInput) {
	const [piece] = await db
		.select()
		.from(pieces)
		.where(and(eq(pieces.slug, input.slug), eq(pieces.active, true)));
	if (!piece)
		throw new DomainError(404, 'We do not offer that piece any more.', {
			fields: { slug: ['Unknown piece.'] }
		});

	const [wood] = await db
		.select()
		.from(woods)
		.innerJoin(pieceWoods, and(eq(pieceWoods.woodId, woods.id), eq(pieceWoods.pieceId, piece.id)))
		.where(eq(woods.slug, input.wood));
	if (!wood) {
		throw new DomainError(400, 'Choose one of the woods this piece is made in.', {
			fields: {
				wood: ['Choose one of the woods listed for this piece.']
			}
		});
	}

	let personalisation: Personalisation | null = null;
	if (input.initials) {
		if (!piece.personalisable) {
			throw new DomainError(400, 'This piece is not carved with initials.', {
				fields: {
					initials: ['This piece is not carved with initials.']
				}
			});
		}
		const result = personalise(piece, wood.woods, { initials: input.initials, style: input.style });
		if (!result.ok)
			throw new DomainError(400, result.message ?? 'Check the initials.', {
				fields: result.fields
			});
		personalisation = result.snapshot;
	}

	if (!personalisation) {
		const [same] = await db
			.select({ id: cartLines.id, quantity: cartLines.quantity })
			.from(cartLines)
			.where(
				and(
					eq(cartLines.cartId, cartId),
					eq(cartLines.pieceId, piece.id),
					eq(cartLines.woodId, wood.woods.id),
					isNull(cartLines.personalisation)
				)
			);
		const wanted = (same?.quantity ?? 0) + input.quantity;
		const onHand = await stockOnHand(piece.id, wood.woods.id);
		if (onHand < wanted) {
			const message =
				onHand === 0
					? piece.personalisable
						? `None ready now in ${wood.woods.name}. Add initials and we will carve one for you.`
						: `Sold out in ${wood.woods.name}.`
					: `Only ${onHand} ready now in ${wood.woods.name}.`;
			throw new DomainError(409, message, { fields: { quantity: [message] } });
		}
		if (same) {
			await db.update(cartLines).set({ quantity: wanted }).where(eq(cartLines.id, same.id));
			await touch(cartId);
			return same.id;
		}
	}
	const [{ id }] = await db
		.insert(cartLines)
		.values({
			cartId,
			pieceId: piece.id,
			woodId: wood.woods.id,
			quantity: input.quantity,
			personalisation,
			createdAt: new Date()
		})
		.$returningId();
	await touch(cartId);
	return id;
}

async function lineOf(cartId: string, lineId: number) {
	const [line] = await db
		.select()
		.from(cartLines)
		.where(and(eq(cartLines.id, lineId), eq(cartLines.cartId, cartId)));
	if (!line) throw new DomainError(404, 'That line is no longer in your basket.');
	return line;
}

export async function setQuantity(cartId: string, lineId: number, quantity: number) {
	const line = await lineOf(cartId, lineId);
	if (quantity === 0) return removeLine(cartId, lineId);
	if (line.personalisation) {
		const [wood] = await db
			.select({ slug: woods.slug })
			.from(woods)
			.where(eq(woods.id, line.woodId));
		const tooSmall = snapshotRefusal(line.personalisation, wood?.slug ?? '');
		if (tooSmall) throw new DomainError(400, tooSmall, { fields: { quantity: [tooSmall] } });
	}
	if (!line.personalisation) {
		const onHand = await stockOnHand(line.pieceId, line.woodId);
		if (onHand < quantity) {
			const message = onHand === 0 ? 'Sold out.' : `Only ${onHand} ready now.`;
			throw new DomainError(409, message, { fields: { quantity: [message] } });
		}
	}
	await db.update(cartLines).set({ quantity }).where(eq(cartLines.id, lineId));
	await touch(cartId);
}

export async function removeLine(cartId: string, lineId: number) {
	await lineOf(cartId, lineId);
	await db.delete(cartLines).where(eq(cartLines.id, lineId));
	await touch(cartId);
}

export async function setDestination(cartId: string, country: string) {
	await db
		.update(carts)
		.set({ destination: country, updatedAt: new Date() })
		.where(eq(carts.id, cartId));
}

async function touch(cartId: string) {
	await db.update(carts).set({ updatedAt: new Date() }).where(eq(carts.id, cartId));
}

export async function cartCount(cartId: string | null): Promise<number> {
	if (!cartId) return 0;
	const [row] = await db
		.select({ n: sql<number>`coalesce(sum(${cartLines.quantity}), 0)`.mapWith(Number) })
		.from(cartLines)
		.where(eq(cartLines.cartId, cartId));
	return row?.n ?? 0;
}

/** What the cart page and /api/cart show: priced lines with their previews, and totals. */
export async function cartSummary(cartId: string | null, country?: string) {
	let destination = country;
	if (!destination && cartId) {
		const [row] = await db.select({ d: carts.destination }).from(carts).where(eq(carts.id, cartId));
		destination = row?.d ?? undefined;
	}
	destination ??= HOME_COUNTRY;
	const priced = cartId ? await priceCart(cartId, destination) : await priceCart('', destination);
	const pieceIds = [...new Set(priced.lines.map((l) => l.pieceId))];
	const firstPhotos = pieceIds.length
		? await db
				.select({
					pieceId: photos.pieceId,
					storageKey: photos.storageKey,
					position: photos.position
				})
				.from(photos)
				.where(inArray(photos.pieceId, pieceIds))
				.orderBy(asc(photos.position))
		: [];
	const photoOf = (pieceId: number) =>
		firstPhotos.find((p) => p.pieceId === pieceId)?.storageKey ?? null;
	const readyBy = await basketReadyBy(priced.lines.filter((l) => !l.fromStock));
	return {
		// The whole basket as one order joining the queue now: the date the paid e-mail repeats.
		orderReadyBy: priced.lines.length ? await readyByNow(carvedMinutes(priced.lines)) : null,
		country: destination,
		zone: priced.zone,
		currency: priced.currency,
		count: priced.count,
		subtotalMinor: priced.subtotalMinor,
		taxMinor: priced.taxMinor,
		rateBp: priced.rateBp,
		shippingMinor: priced.shippingMinor,
		shippingKnown: priced.shippingKnown,
		billableGrams: priced.billableGrams,
		totalMinor: priced.totalMinor,
		problems: priced.problems,
		lines: priced.lines.map((l) => ({
			id: l.id,
			slug: l.slug,
			title: l.title,
			photoKey: photoOf(l.pieceId),
			wood: { slug: l.woodSlug, name: l.woodName, toneLight: l.toneLight, toneDark: l.toneDark },
			quantity: l.quantity,
			unitMinor: l.unitMinor,
			totalMinor: l.totalMinor,
			fromStock: l.fromStock,
			available: l.available,
			leadDays: l.leadDays,
			readyBy: readyBy[l.id] ?? null,
			personalisation: l.personalisation,
			previewSvg: l.personalisation
				? previewSvg(
						l.personalisation,
						{ slug: l.woodSlug, toneLight: l.toneLight, toneDark: l.toneDark },
						{ widthMm: l.widthMm, lengthMm: l.lengthMm, thicknessMm: l.thicknessMm },
						`pv${l.id}`
					)
				: null
		}))
	};
}

export type CartSummary = Awaited<ReturnType<typeof cartSummary>>;
