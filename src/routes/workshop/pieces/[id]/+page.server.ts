import { error } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import {
	allWoods,
	pieceForEdit,
	setPieceActive,
	updatePiece
} from '$lib/server/catalogue/pieces-admin';
import { deletePhoto, listPhotos, movePhoto, setPhotoAlt } from '$lib/server/catalogue/photos';
import { photoForm, pieceIdParam, savePieceForm } from '$lib/server/catalogue/piece-forms';
import { photoAction, photoAltAction, photoMoveAction } from '$lib/catalogue/photo-schema';
import { pieceStock } from '$lib/server/stock/piece-stock';
import { pieceStockForm } from '$lib/server/stock/piece-stock-form';
import { fairForStock } from '$lib/server/fairs/fairs';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'owner');
	const id = pieceIdParam(event.params.id);
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
		const id = pieceIdParam(event.params.id);
		const out = await savePieceForm(event.request, (f) => updatePiece(id, f));
		if (out.failure) return out.failure;
		if (!out.result) error(404, 'There is no such piece.');
		return { saved: true };
	},
	retire: async (event) => {
		requireRole(event, 'owner');
		const found = await setPieceActive(pieceIdParam(event.params.id), false);
		if (!found) error(404, 'There is no such piece.');
		return { retired: true };
	},
	restore: async (event) => {
		requireRole(event, 'owner');
		const found = await setPieceActive(pieceIdParam(event.params.id), true);
		if (!found) error(404, 'There is no such piece.');
		return { restored: true };
	},
	alt: async (event) => {
		requireRole(event, 'owner');
		const id = pieceIdParam(event.params.id);
		return photoForm(event.request, photoAltAction, (p) => setPhotoAlt(id, p.photoId, p.alt));
	},
	move: async (event) => {
		requireRole(event, 'owner');
		const id = pieceIdParam(event.params.id);
		return photoForm(event.request, photoMoveAction, (p) =>
			movePhoto(id, p.photoId, p.by === '-1' ? -1 : 1)
		);
	},
	deletePhoto: async (event) => {
		requireRole(event, 'owner');
		const id = pieceIdParam(event.params.id);
		return photoForm(event.request, photoAction, (p) => deletePhoto(id, p.photoId));
	},
	stock: async (event) => {
		const user = requireRole(event, 'owner');
		return pieceStockForm(event.request, pieceIdParam(event.params.id), user.id, fairForStock);
	}
};
