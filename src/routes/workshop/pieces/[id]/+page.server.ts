import { error } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/auth/guard';
import {
	allWoods,
	pieceForEdit,
	setPieceActive,
	updatePiece
} from '$lib/server/catalogue/pieces-admin';
import { deletePhoto, listPhotos, movePhoto, setPhotoAlt } from '$lib/server/catalogue/photos';
import { photoAlt } from '$lib/catalogue/photo-schema';
import { stockAdjustForm, stockDelta } from '$lib/stock/stock-schema';
import { adjustPieceStock, pieceStock } from '$lib/server/stock/piece-stock';
import { parseForm } from '$lib/forms/parse-form';
import { failFrom, runForm } from '$lib/server/errors/form-answer';
import { DomainError } from '$lib/server/errors/domain-error';
import { savePieceForm } from '../piece-actions';
import type { Actions, PageServerLoad } from './$types';

const pieceId = (raw: string) => {
	const id = Number(raw);
	if (!Number.isInteger(id) || id <= 0) error(404, 'There is no such piece.');
	return id;
};

const photoAction = z.object({ photoId: z.coerce.number().int().positive() });
const altAction = photoAction.extend({ alt: photoAlt });
const moveAction = photoAction.extend({ by: z.enum(['-1', '1']) });

/** Reads a photo form; bad input or a photo that is gone answers 400/404 with a message. */
async function withPhoto<S extends z.ZodType>(
	request: Request,
	schema: S,
	run: (p: z.infer<S>) => Promise<void>
) {
	const saved = (p: z.infer<S>) => run(p).then(() => ({ photoSaved: true }));
	return runForm(request, schema, saved, { form: 'photo' });
}

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'owner');
	const id = pieceId(event.params.id);
	const [piece, woods, photos, stock] = await Promise.all([
		pieceForEdit(id),
		allWoods(),
		listPhotos(id),
		pieceStock(id)
	]);
	if (!piece) error(404, 'There is no such piece.');
	return { piece, woods, photos, stock, created: event.url.searchParams.has('created') };
};

export const actions: Actions = {
	save: async (event) => {
		requireRole(event, 'owner');
		const id = pieceId(event.params.id);
		const out = await savePieceForm(event.request, (f) => updatePiece(id, f));
		if (out.failure) return out.failure;
		if (!out.result) error(404, 'There is no such piece.');
		return { saved: true };
	},
	retire: async (event) => {
		requireRole(event, 'owner');
		if (!(await setPieceActive(pieceId(event.params.id), false)))
			error(404, 'There is no such piece.');
		return { retired: true };
	},
	restore: async (event) => {
		requireRole(event, 'owner');
		if (!(await setPieceActive(pieceId(event.params.id), true)))
			error(404, 'There is no such piece.');
		return { restored: true };
	},
	alt: async (event) => {
		requireRole(event, 'owner');
		const id = pieceId(event.params.id);
		return withPhoto(event.request, altAction, (p) => setPhotoAlt(id, p.photoId, p.alt));
	},
	move: async (event) => {
		requireRole(event, 'owner');
		const id = pieceId(event.params.id);
		return withPhoto(event.request, moveAction, (p) =>
			movePhoto(id, p.photoId, p.by === '-1' ? -1 : 1)
		);
	},
	deletePhoto: async (event) => {
		requireRole(event, 'owner');
		const id = pieceId(event.params.id);
		return withPhoto(event.request, photoAction, (p) => deletePhoto(id, p.photoId));
	},
	stock: async (event) => {
		const user = requireRole(event, 'owner');
		const id = pieceId(event.params.id);
		const parsed = await parseForm(event.request, stockAdjustForm, { extra: { form: 'stock' } });
		if (!parsed.ok) return parsed.failure;
		const { woodId, place, reason } = parsed.data;
		try {
			const r = await adjustPieceStock(
				id,
				{ woodId, place, reason, delta: stockDelta(parsed.data) },
				user.id
			);
			return { stockSaved: r.quantity };
		} catch (err) {
			if (!(err instanceof DomainError)) throw err;
			if (err.status === 404) error(404, err.message);
			return failFrom(err, { form: 'stock', values: parsed.values });
		}
	}
};
