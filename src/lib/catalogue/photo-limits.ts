/**
 * Limits on uploaded photos, checked in the browser before sending and again on the server.
 * 12 MB covers a full-size phone JPEG; 40 megapixels covers any camera we expect while keeping a
 * decoded image (4 bytes a pixel, ~160 MB) within reach of a small server. A tiny file that
 * claims more pixels than that is a decompression bomb and is refused from its header alone.
 */
export const MAX_PHOTO_BYTES = 12 * 1024 * 1024;
export const MAX_PHOTO_PIXELS = 40_000_000;
export const PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;
export const PHOTO_TYPES_TEXT = 'JPEG, PNG or WebP';
