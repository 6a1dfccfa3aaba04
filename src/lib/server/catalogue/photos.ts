/**
 * A piece's photos: add (stored as variants in the photo bucket), alt text, order, delete.
 * The bucket holds the bytes, the photos table says which piece shows which key in what order.
 */
import { randomBytes } from 'node:crypto';
import { and, asc, eq, max } from 'drizzle-orm';
import { db } from '../db';
import { transact } from '../db/retry';
import { photos, pieces } from '../db/schema';
import { deletePrefix, storePhoto } from './photo-storage';
import { DomainError } from '../errors/domain-error';

/** Stores the variants, then the row; a failed insert removes the stored objects again. */
export async function addPhoto(pieceId: number, bytes: Buffer, alt: string) {
	const [piece] = await db
		.select({ slug: pieces.slug })
		.from(pieces)
		.where(eq(pieces.id, pieceId))
		.limit(1);
	if (!piece) throw new DomainError(404, 'There is no such piece.');
	// A fresh key per upload: variants never change under a key, so they can be cached for good.
	const key = `pieces/${piece.slug}/${randomBytes(6).toString('hex')}`;
	const size = await storePhoto(key, bytes);
	try {
		const [{ next }] = await db
			.select({ next: max(photos.position) })
			.from(photos)
			.where(eq(photos.pieceId, pieceId));
		const [{ id }] = await db
			.insert(photos)
			.values({
				pieceId,
				storageKey: key,
				alt,
				position: (next ?? -1) + 1,
				width: size.width,
				height: size.height
			})
			.$returningId();
		return { id, storageKey: key, alt, ...size };
	} catch (err) {
		await deletePrefix(`${key}/`);
		throw err;
	}
}

export async function listPhotos(pieceId: number) {
	return db
		.select({
			id: photos.id,
			storageKey: photos.storageKey,
			alt: photos.alt,
			position: photos.position,
			width: photos.width,
			height: photos.height
		})
		.from(photos)
		.where(eq(photos.pieceId, pieceId))
		.orderBy(asc(photos.position), asc(photos.id));
}

export async function setPhotoAlt(pieceId: number, photoId: number, alt: string) {
	const res = await db
		.update(photos)
		.set({ alt })
		.where(and(eq(photos.id, photoId), eq(photos.pieceId, pieceId)));
	if (res[0].affectedRows === 0) throw new DomainError(404, 'That photo is gone.');
}

/** Moves a photo one place earlier or later; positions are rewritten 0…n-1 in one transaction. */
export async function movePhoto(pieceId: number, photoId: number, by: -1 | 1) {
	await transact(async (tx) => {
		const list = await tx
			.select({ id: photos.id })
			.from(photos)
			.where(eq(photos.pieceId, pieceId))
			.orderBy(asc(photos.position), asc(photos.id))
			.for('update');
		const at = list.findIndex((p) => p.id === photoId);
		if (at < 0) throw new DomainError(404, 'That photo is gone.');
		const to = at + by;
		if (to < 0 || to >= list.length) return;
		[list[at], list[to]] = [list[to], list[at]];
		for (const [position, p] of list.entries()) {
			await tx.update(photos).set({ position }).where(eq(photos.id, p.id));
		}
	});
}

/** Removes the row first (the shop stops showing it), then every stored variant. */
export async function deletePhoto(pieceId: number, photoId: number) {
	const [row] = await db
		.select({ storageKey: photos.storageKey })
		.from(photos)
		.where(and(eq(photos.id, photoId), eq(photos.pieceId, pieceId)));
	if (!row) throw new DomainError(404, 'That photo is gone.');
	await db.delete(photos).where(eq(photos.id, photoId));
	await deletePrefix(`${row.storageKey}/`);
}
