// Turns an untrusted upload into a photo that is safe to store and serve: the bytes must
// be a JPEG, PNG or WebP that sharp can decode within the size limits, and what comes out
// is a fresh encode of the decoded pixels only. Re-encoding is the real defence: metadata
// (EXIF with GPS position, ICC, XMP, comments) and anything smuggled around the picture
// data do not survive it. No "server-only" import: the fake Cloudinary server uses it too.

import sharp, { type Metadata } from "sharp";
import {
  MAX_IMAGE_PIXELS,
  MAX_IMAGE_SIDE_PX,
  MAX_UPLOAD_BYTES,
  type AcceptedImageFormat,
} from "./image-limits";
import { ImageRejectedError } from "./image-rejected-error";
import { classifyTrailer, findImageEnd, sniffImage } from "./image-sniff";

export { MAX_IMAGE_PIXELS, MAX_IMAGE_SIDE_PX, MAX_UPLOAD_BYTES } from "./image-limits";
export { ImageRejectedError, type ImageRejectedCode } from "./image-rejected-error";

export interface SanitizeImageOptions {
  maxBytes?: number;
  maxSidePx?: number;
  maxPixels?: number;
  /** Encoder quality for JPEG and WebP output, 1–100. */
  quality?: number;
}

export interface SanitizedImage {
  data: Buffer;
  format: AcceptedImageFormat;
  width: number;
  height: number;
  bytes: number;
}

// Common practice, no source: 82 keeps photos visually unchanged at a fraction of the size.
const DEFAULT_QUALITY = 82;

const ACCEPTED_LIST = "JPEG, PNG or WebP";

const SHARP_FORMAT: Record<AcceptedImageFormat, string> = { jpg: "jpeg", png: "png", webp: "webp" };

function megabytes(n: number): string {
  return `${Math.round((n / (1024 * 1024)) * 10) / 10} MB`;
}

export async function sanitizeImage(
  buf: Buffer,
  opts: SanitizeImageOptions = {},
): Promise<SanitizedImage> {
  const maxBytes = opts.maxBytes ?? MAX_UPLOAD_BYTES;
  const maxSide = opts.maxSidePx ?? MAX_IMAGE_SIDE_PX;
  const maxPixels = opts.maxPixels ?? MAX_IMAGE_PIXELS;
  const quality = opts.quality ?? DEFAULT_QUALITY;

  if (!Buffer.isBuffer(buf) || buf.length === 0) {
    throw new ImageRejectedError("not_an_image", "The file is empty.");
  }
  if (buf.length > maxBytes) {
    throw new ImageRejectedError(
      "too_large",
      `The photo is ${megabytes(buf.length)}; the limit is ${megabytes(maxBytes)}.`,
    );
  }

  const format = checkContent(buf);

  let meta: Metadata;
  try {
    meta = await sharp(buf, { limitInputPixels: false }).metadata();
  } catch (cause) {
    throw new ImageRejectedError("corrupt", "The photo could not be read; the file may be damaged.", { cause });
  }
  // sharp sniffs independently; a disagreement means a file crafted to look like one
  // format to us and another to the decoder.
  if (meta.format !== SHARP_FORMAT[format]) {
    throw new ImageRejectedError("corrupt", "The photo could not be read; the file may be damaged.");
  }
  // Header dimensions are checked before decoding so a bomb never allocates its pixels.
  const { width = 0, height = 0 } = meta;
  if (width > maxSide || height > maxSide || width * height > maxPixels) {
    throw new ImageRejectedError(
      "too_many_pixels",
      `The photo is ${width} × ${height} pixels; the limit is ${maxSide} pixels a side and ` +
        `${Math.round(maxPixels / 1e6)} megapixels.`,
    );
  }

  try {
    // limitInputPixels repeats the check inside libvips in case the header lied;
    // failOn "warning" (sharp's default, recommended for untrusted input) refuses
    // truncated or damaged pixel data instead of filling it in.
    let pipeline = sharp(buf, { limitInputPixels: maxPixels, failOn: "warning" }).rotate();
    pipeline =
      format === "jpg"
        ? pipeline.jpeg({ quality })
        : format === "png"
          ? pipeline.png()
          : pipeline.webp({ quality });
    // No withMetadata/keepExif/keepIccProfile: sharp then writes no EXIF, XMP or ICC.
    const { data, info } = await pipeline.toBuffer({ resolveWithObject: true });
    return { data, format, width: info.width, height: info.height, bytes: data.length };
  } catch (cause) {
    if (cause instanceof Error && /pixel limit/i.test(cause.message)) {
      throw new ImageRejectedError("too_many_pixels", "The photo has too many pixels.", { cause });
    }
    throw new ImageRejectedError("corrupt", "The photo could not be read; the file may be damaged.", { cause });
  }
}

/** Decides from the bytes alone whether the upload may go on to the decoder. */
function checkContent(buf: Buffer): AcceptedImageFormat {
  const sniffed = sniffImage(buf);
  if (sniffed.kind === "markup") {
    throw new ImageRejectedError(
      "not_an_image",
      `This file is a web page or drawing (HTML, SVG or XML), not a photo. Upload a ${ACCEPTED_LIST} photo.`,
    );
  }
  if (sniffed.kind === "unsupported") {
    throw new ImageRejectedError(
      "unsupported_format",
      `${sniffed.name} files aren't accepted. Upload a ${ACCEPTED_LIST} photo.`,
    );
  }
  if (sniffed.kind === "unknown") {
    throw new ImageRejectedError("not_an_image", `This file isn't a photo. Upload a ${ACCEPTED_LIST} photo.`);
  }

  // Bytes after the end marker are dropped by the re-encode anyway; markup there is
  // refused outright because it only gets there on purpose (an image/HTML polyglot).
  const end = findImageEnd(buf, sniffed.format);
  if (end !== null && classifyTrailer(buf.subarray(end)) === "markup") {
    throw new ImageRejectedError(
      "not_an_image",
      "This file has web page or script content hidden after the picture, so it can't be accepted.",
    );
  }
  return sniffed.format;
}
