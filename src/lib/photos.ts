/** Photo variants written by the storage module: `${key}/${width}.webp`, served under /photos. */
export const PHOTO_WIDTHS = [320, 640, 1200] as const;

export const photoUrl = (key: string, width: number = 640) => `/photos/${key}/${width}.webp`;

export const photoSrcset = (key: string) =>
	PHOTO_WIDTHS.map((w) => `${photoUrl(key, w)} ${w}w`).join(', ');
