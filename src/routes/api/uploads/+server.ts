import { json } from '@sveltejs/kit';
import { requireRoleApi } from '$lib/server/auth/guard';
import { apiError, apiFrom, apiInvalid } from '$lib/server/http/api-errors';
import { isDomainError } from '$lib/server/errors/domain-error';
import { addPhoto } from '$lib/server/catalogue/photos';
import { uploadFields } from '$lib/catalogue/photo-schema';
import { MAX_PHOTO_BYTES } from '$lib/catalogue/photo-limits';
import { UPLOAD_TOO_LARGE } from '$lib/server/http/body-limit';
import type { RequestHandler } from './$types';

/**
 * One photo per request (the browser sends several side by side, each with its own progress):
 * multipart with `pieceId`, `alt` and `file`. Checked by content on the server whatever the
 * browser said; a refused file stores nothing. 201 with the stored photo.
 */
export const POST: RequestHandler = async (event) => {
	requireRoleApi(event, 'owner');
	let form: FormData;
	try {
		form = await event.request.formData();
	} catch (err) {
		// A body sent without a length that passed adapter-node's BODY_SIZE_LIMIT while read.
		if ((err as { status?: number }).status === 413) return apiError(413, UPLOAD_TOO_LARGE);
		return apiError(400, 'Send the photo as a multipart form with a file field.');
	}
	const fields = uploadFields.safeParse({ pieceId: form.get('pieceId'), alt: form.get('alt') });
	if (!fields.success) return apiInvalid(fields.error);
	const file = form.get('file');
	if (!(file instanceof File))
		return apiError(400, 'Choose a photo to send.', { file: ['Missing'] });
	if (file.size > MAX_PHOTO_BYTES) return apiError(413, `${file.name}: ${UPLOAD_TOO_LARGE}`);
	try {
		const photo = await addPhoto(
			fields.data.pieceId,
			Buffer.from(await file.arrayBuffer()),
			fields.data.alt
		);
		return json({ photo }, { status: 201 });
	} catch (err) {
		// A refused file is named, since the browser sends several side by side.
		if (isDomainError(err, 'photo')) return apiError(err.status, `${file.name}: ${err.message}`);
		if (isDomainError(err)) return apiFrom(err);
		throw err;
	}
};
