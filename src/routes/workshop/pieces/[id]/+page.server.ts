import { error, fail } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/auth/guard';
import {
	allWoods,
	pieceForEdit,
	setPieceActive,
	updatePiece
} from '$lib/server/catalogue/pieces-admin';
import {
	deletePhoto,
	listPhotos,
	movePhoto,
	PhotoNotFound,
	setPhotoAlt
} from '$lib/server/catalogue/photos';
import { photoAlt } from '$lib/catalogue/photo-schema';
import { stockAdjustForm, stockDelta } from '$lib/stock/stock-schema';
import { adjustPieceStock, pieceStock, StockChangeError } from '$lib/server/stock/piece-stock';
import { fairForStock } from '$lib/server/fairs/fairs';
import { fieldErrors, firstError, formTexts, parseForm } from '$lib/forms/parse-form';
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
	const parsed = await parseForm(request, schema);
	if (!parsed.ok) return fail(400, { photoError: firstError(parsed.errors) });
	try {
		await run(parsed.data);
	} catch (err) {
		if (err instanceof PhotoNotFound) return fail(404, { photoError: err.message });
		throw err;
	}
	return { photoSaved: true };
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
		const values = formTexts(await event.request.formData());
		const parsed = stockAdjustForm.safeParse(values);
		if (!parsed.success) {
			return fail(400, { stockErrors: fieldErrors(parsed.error), stockValues: values });
		}
		const { woodId, place, reason } = parsed.data;
		try {
			const r = await adjustPieceStock(
				id,
				{ woodId, place, reason, delta: stockDelta(parsed.data) },
				user.id,
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
};
