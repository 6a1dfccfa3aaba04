/**
 * Photo variants written by the storage module, served under /photos:
 * `${key}/${width}.webp` and a JPEG fallback `${key}/${width}.jpg` at each nominal width.
 * A variant is never wider than the original, so srcset states each one's real width.
 */
export const PHOTO_WIDTHS = [400, 800, 1600] as const;
export type PhotoWidth = (typeof PHOTO_WIDTHS)[number];
export type PhotoFormat = 'webp' | 'jpg';

export const photoUrl = (key: string, width: PhotoWidth = 800, format: PhotoFormat = 'webp') =>
	`/photos/${key}/${width}.${format}`;

/** `url 400w, url 800w, …` with each variant's real width (smaller originals are not upscaled). */
export function photoSrcset(key: string, originalWidth: number, format: PhotoFormat = 'webp') {
	const seen = new Set<number>();
	const parts: string[] = [];
	for (const w of PHOTO_WIDTHS) {
		const real = Math.min(w, originalWidth);
		if (seen.has(real)) continue;
		seen.add(real);
		parts.push(`${photoUrl(key, w, format)} ${real}w`);
	}
	return parts.join(', ');
}
