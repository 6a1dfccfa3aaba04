import { z } from 'zod';

/** Alt text says what the photo shows, for buyers who cannot see it. */
export const photoAlt = z
	.string()
	.trim()
	.min(3, 'Describe the photo in a few words.')
	.max(200, 'Keep the description under 200 characters.');

/** The upload form's fields besides the file itself. */
export const uploadFields = z.object({
	pieceId: z.coerce.number({ error: 'Say which piece the photo is for.' }).int().positive(),
	alt: photoAlt
});

/** The piece page's photo buttons: which photo, and for a new description or a move, what. */
export const photoAction = z.object({ photoId: z.coerce.number().int().positive() });
export const photoAltAction = photoAction.extend({ alt: photoAlt });
export const photoMoveAction = photoAction.extend({ by: z.enum(['-1', '1']) });
