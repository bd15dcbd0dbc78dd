// Upload limits for listing photos. Kept apart from sanitize-image.ts (which pulls in
// sharp) so the browser upload form can check the size before sending anything.

/** Largest upload accepted, in bytes. Product policy; it matches the per-image limit of
 * Cloudinary's free plan (from memory), so the fake refuses what production would. */
export const MAX_UPLOAD_BYTES = 10 * 1024 * 1024;

/** Longest side accepted, in pixels. Product policy, no source: well above any phone
 * camera's output, well below what would make re-encoding slow. */
export const MAX_IMAGE_SIDE_PX = 8000;

/** Largest pixel count accepted (40 megapixels). Product policy, no source. Passed to
 * sharp's limitInputPixels so a small file that claims huge dimensions (a decompression
 * bomb) is refused before any pixel memory is allocated. */
export const MAX_IMAGE_PIXELS = 40_000_000;

/** The formats a listing photo may arrive in, and the only ones the app stores. */
export const ACCEPTED_IMAGE_FORMATS = ["jpg", "png", "webp"] as const;
export type AcceptedImageFormat = (typeof ACCEPTED_IMAGE_FORMATS)[number];

/** For `<input type="file" accept=...>`; a hint to the picker, never a check. */
export const ACCEPTED_IMAGE_MIME_TYPES = ["image/jpeg", "image/png", "image/webp"] as const;
